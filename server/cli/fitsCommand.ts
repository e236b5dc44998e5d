import { fitSettingsOverview } from "../services/fits/fitSettings.ts";
import { UserError } from "../userError.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";
import { formatTable } from "./formatTable.ts";
import { openCliDatabase } from "./openCliDatabase.ts";

export const fitsCommand: Command = {
  name: "fits",
  summary: "stored fit settings and how many profiles of each genotype have fits under each",
  help: `Usage: morphogauge fits settings [--channel C] [options]

A fit setting is a model with its window, weights, background and fixed
parameters. Each stored fit belongs to one; "fit --as NAME" names it. Group
analyses (compare, track, plan, the report) use one setting for all groups:
--fits NAME, or by default the one setting that covers every selected profile.

  settings              one line per setting: its name, what it is, and per genotype
                        the profiles with a fit under it out of all steady-state profiles
  --channel C           count only profiles of this channel
${COMMON_HELP}`,
  options: { ...COMMON_OPTIONS, channel: { type: "string" } },
  allowPositionals: true,
  async run(values, positionals, io) {
    const [what, ...rest] = positionals;
    if (what !== "settings" || rest.length > 0) throw new UserError("bad-option", `Say what to list: "morphogauge fits settings"${what ? ` (not "${positionals.join(" ")}")` : ""}.`);
    const { db } = await openCliDatabase(values.db as string | undefined, io);
    try {
      const out = fitSettingsOverview(db, { channel: values.channel as string | undefined });
      if (values.json) {
        io.stdout(JSON.stringify(out, null, 2) + "\n");
        return 0;
      }
      if (out.settings.length === 0) {
        io.stdout("No fits stored yet. Fit with `morphogauge fit` (name the setting with --as NAME).\n");
        return 0;
      }
      io.stdout(
        formatTable(
          ["setting", "what it is", "profiles with a fit (per genotype)"],
          out.settings.map((s) => [s.name, s.description, s.coverage.map((c) => `${c.genotype} ${c.fitted}/${c.profiles}`).join(", ")]),
        ),
      );
      return 0;
    } finally {
      db.close();
    }
  },
};
