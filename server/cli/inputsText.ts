import type { LeftOut } from "../services/exclusions/exclusionService.ts";
import type { FitSettingSummary } from "../services/fits/fitSettings.ts";
import type { ModelPreference } from "../services/groups/modelPreference.ts";

/** One left-out embryo or profile in words: "wt-03 (out of focus)" or "wt-03, channel glm (bleached)". */
export function leftOutText(l: LeftOut): string {
  return `${l.embryo}${l.scope === "profile" ? `, channel ${l.channel}${l.time_s !== null ? ` at ${l.time_s} s` : ""}` : ""} (${l.reason})`;
}

/** The lines every group analysis prints about its inputs: setting, fits, who was left out, model preference. */
export function inputsText(r: {
  fit_setting: FitSettingSummary | null;
  fit_setting_chosen: string | null;
  fit_ids: number[] | null;
  fitted_now: number | null;
  left_out: LeftOut[] | null;
  model_preference: ModelPreference | null;
}): string {
  const lines: string[] = [];
  if (r.fit_setting) {
    lines.push(`Fit setting: ${r.fit_setting.name} (${r.fit_setting.description}); ${r.fit_setting_chosen ?? ""}`);
    lines.push(`  ${r.fit_ids?.length ?? 0} fits used${r.fitted_now ? `, ${r.fitted_now} of them fitted now with this setting` : ""} (their ids: --json, field fit_ids; re-run with --fit-ids)`);
  }
  if (r.left_out && r.left_out.length) lines.push(`Left out (excluded): ${r.left_out.map(leftOutText).join("; ")}`);
  for (const w of r.model_preference?.warnings ?? []) lines.push(`! ${w}`);
  return lines.length ? lines.join("\n") + "\n" : "";
}
