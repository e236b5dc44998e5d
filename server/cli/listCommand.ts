import { listProfiles } from "../../db/profiles.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";
import { openCliDatabase } from "./openCliDatabase.ts";
import { formatTable } from "./formatTable.ts";

export const listCommand: Command = {
  name: "list",
  summary: "list stored embryos and profiles",
  help: `Usage: morphogauge list [--genotype G] [--channel C] [options]

One line per stored profile: embryo, genotype, channel, points, position
range (µm) and the unit the positions were imported in.

  --genotype G   only this genotype
  --channel C    only this channel
${COMMON_HELP}`,
  options: { ...COMMON_OPTIONS, genotype: { type: "string" }, channel: { type: "string" } },
  async run(values, _positionals, io) {
    const { db } = await openCliDatabase(values.db as string | undefined, io);
    try {
      const rows = listProfiles(db, { genotype: values.genotype as string | undefined, channel: values.channel as string | undefined });
      if (values.json) {
        io.stdout(
          JSON.stringify(
            {
              profiles: rows.map((r) => ({
                profile_id: r.profileId,
                embryo: r.embryo,
                genotype: r.genotype,
                channel: r.channel,
                time_s: r.timeS,
                stage: r.stage,
                age_s: r.ageS,
                length_um: r.lengthUm,
                dosage: r.dosage,
                n_points: r.nPoints,
                range_um: r.rangeUm,
                position_unit: r.positionUnit,
                pixel_size_um: r.pixelSizeUm,
                flipped: r.flipped,
                import_id: r.importId,
                file: r.fileName,
              })),
            },
            null,
            2,
          ) + "\n",
        );
        return 0;
      }
      if (rows.length === 0) {
        io.stdout("No profiles stored yet. Import some with `morphogauge import FILE` or load the demo with `morphogauge demo`.\n");
        return 0;
      }
      io.stdout(
        formatTable(
          ["embryo", "genotype", "channel", "points", "range (µm)", "unit", "length (µm)"],
          rows.map((r) => [
            r.embryo + (r.flipped ? " (flipped)" : ""),
            r.genotype,
            r.channel + (r.timeS !== null ? ` @${r.timeS} s` : ""),
            String(r.nPoints),
            `${fmt(r.rangeUm[0])}–${fmt(r.rangeUm[1])}`,
            r.positionUnit === "um" ? "µm" : r.positionUnit === "px" ? `px (${r.pixelSizeUm} µm)` : "x/L",
            r.lengthUm === null ? "—" : fmt(r.lengthUm),
          ]),
        ),
      );
      io.stdout(`${rows.length} profile${rows.length === 1 ? "" : "s"} from ${new Set(rows.map((r) => r.embryoId)).size} embryos\n`);
      return 0;
    } finally {
      db.close();
    }
  },
};

function fmt(v: number): string {
  return Number.isInteger(v) ? String(v) : v.toFixed(1);
}
