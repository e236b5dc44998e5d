import { ExcludeRequest, IncludeRequest } from "../services/exclusions/exclusionRequest.ts";
import { excludeEmbryo, exclusionOverview, includeEmbryo } from "../services/exclusions/exclusionService.ts";
import { UserError } from "../userError.ts";
import { numberOption } from "./cliNumbers.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";
import { formatTable } from "./formatTable.ts";
import { leftOutText } from "./inputsText.ts";
import { openCliDatabase } from "./openCliDatabase.ts";
import { zodToUserError } from "./zodToUserError.ts";

const TARGET_OPTIONS = { ...COMMON_OPTIONS, reason: { type: "string" }, channel: { type: "string" }, time: { type: "string" } } as const;
const TARGET_HELP = `  --channel C           only this channel's profile of the embryo (the whole embryo by default)
  --time T              with --channel: only the profile at time T (s) of a time course`;

function target(positionals: string[], values: Record<string, unknown>, verb: string) {
  if (positionals.length !== 1) throw new UserError("bad-option", `Give one embryo label, e.g. morphogauge ${verb} wt-03${verb === "exclude" ? ' --reason "out of focus"' : ""}.`);
  return { embryo: positionals[0], channel: values.channel as string | undefined, timeS: numberOption("time", values.time as string | undefined), reason: values.reason as string | undefined };
}

export const excludeCommand: Command = {
  name: "exclude",
  summary: "leave an embryo (or one of its profiles) out of group analyses, with a reason",
  help: `Usage: morphogauge exclude LABEL --reason "out of focus" [--channel C] [options]

The embryo stays stored; compare, track, plan and precision leave it out by
default and list it with the reason. "morphogauge include LABEL" undoes it;
"morphogauge exclusions" lists what is excluded and the whole history.

  --reason TEXT         why (required), kept in the history and shown by every analysis
${TARGET_HELP}
${COMMON_HELP}`,
  options: TARGET_OPTIONS,
  allowPositionals: true,
  async run(values, positionals, io) {
    const parsed = ExcludeRequest.safeParse(target(positionals, values, "exclude"));
    if (!parsed.success) throw zodToUserError(parsed.error, { timeS: "time" });
    const { db } = await openCliDatabase(values.db as string | undefined, io);
    try {
      const out = excludeEmbryo(db, parsed.data);
      if (values.json) io.stdout(JSON.stringify(out, null, 2) + "\n");
      else io.stdout(`Excluded: ${out.excluded.map(leftOutText).join("; ")}. Undo with: morphogauge include ${parsed.data.embryo}${parsed.data.channel ? ` --channel ${parsed.data.channel}` : ""}\n`);
      return 0;
    } finally {
      db.close();
    }
  },
};

export const includeCommand: Command = {
  name: "include",
  summary: "include an excluded embryo (or profile) in group analyses again",
  help: `Usage: morphogauge include LABEL [--reason TEXT] [--channel C] [options]

Lifts an exclusion; the history keeps both. Including the whole embryo also
lifts the exclusions of its single profiles.

  --reason TEXT         why (optional), kept in the history
${TARGET_HELP}
${COMMON_HELP}`,
  options: TARGET_OPTIONS,
  allowPositionals: true,
  async run(values, positionals, io) {
    const parsed = IncludeRequest.safeParse(target(positionals, values, "include"));
    if (!parsed.success) throw zodToUserError(parsed.error, { timeS: "time" });
    const { db } = await openCliDatabase(values.db as string | undefined, io);
    try {
      const out = includeEmbryo(db, parsed.data);
      if (values.json) io.stdout(JSON.stringify(out, null, 2) + "\n");
      else io.stdout(`Included again: ${out.included.map((l) => `${l.embryo}${l.scope === "profile" ? `, channel ${l.channel}` : ""}`).join("; ")}.\n`);
      return 0;
    } finally {
      db.close();
    }
  },
};

export const exclusionsCommand: Command = {
  name: "exclusions",
  summary: "list excluded embryos and the history of exclusions",
  help: `Usage: morphogauge exclusions [options]

What is excluded now (with the reasons), then every exclusion and inclusion
with its time, oldest first.
${COMMON_HELP}`,
  options: COMMON_OPTIONS,
  async run(values, _positionals, io) {
    const { db } = await openCliDatabase(values.db as string | undefined, io);
    try {
      const out = exclusionOverview(db);
      if (values.json) {
        io.stdout(JSON.stringify(out, null, 2) + "\n");
        return 0;
      }
      io.stdout(out.current.length ? `Excluded now: ${out.current.map(leftOutText).join("; ")}\n` : "Nothing is excluded.\n");
      if (out.history.length) {
        io.stdout("\nHistory:\n");
        io.stdout(formatTable(["when (UTC)", "action", "embryo", "channel", "reason"], out.history.map((h) => [h.since, h.action, h.embryo, h.channel ?? "all", h.reason || "—"])));
      }
      return 0;
    } finally {
      db.close();
    }
  },
};
