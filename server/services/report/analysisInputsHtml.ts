import type { LeftOut } from "../exclusions/exclusionService.ts";
import type { FitSettingSummary } from "../fits/fitSettings.ts";
import type { ModelPreference } from "../groups/modelPreference.ts";
import { escapeHtml } from "./escapeHtml.ts";

const leftOutText = (l: LeftOut) => `${l.embryo}${l.scope === "profile" ? `, channel ${l.channel}` : ""} (${l.reason})`;

/** Who an analysis left out and why, as one paragraph (nothing for analyses stored before exclusions existed). */
export function leftOutHtml(left: LeftOut[] | null | undefined): string {
  if (!left) return "";
  return `<p class="note">${left.length ? `Left out (excluded): ${escapeHtml(left.map(leftOutText).join("; "))}.` : "No embryo was left out."}</p>`;
}

/** A group analysis's inputs: its fit setting, the fit ids, who was left out, and any model AICc prefers. */
export function analysisInputsHtml(r: {
  fit_setting: FitSettingSummary | null;
  fit_setting_chosen: string | null;
  fit_ids: number[] | null;
  fitted_now: number | null;
  left_out: LeftOut[] | null;
  model_preference: ModelPreference | null;
}): string {
  if (!r.fit_setting) return leftOutHtml(r.left_out);
  const fits = `<p class="note">Fit setting <strong>${escapeHtml(r.fit_setting.name)}</strong> (${escapeHtml(r.fit_setting.description)}; ${escapeHtml(r.fit_setting_chosen ?? "")}); ${r.fit_ids?.length ?? 0} fits${r.fitted_now ? `, ${r.fitted_now} fitted for this analysis` : ""}. Fit ids: <span class="ids">${escapeHtml((r.fit_ids ?? []).join(", "))}</span>.</p>`;
  const prefer = (r.model_preference?.warnings ?? []).map((w) => `<li>${escapeHtml(w)}</li>`).join("");
  return `${fits}${leftOutHtml(r.left_out)}${prefer ? `<ul class="warnings">${prefer}</ul>` : ""}`;
}
