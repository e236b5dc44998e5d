import { csvExportUrl } from "../api/exportUrl.ts";
import type { AnalysisInputs } from "../api/types/inputs.ts";
import { el } from "./el.ts";
import { infoNotice, warningNotice } from "./notice.ts";
import { leftOutText } from "./exclusionControls.ts";

/**
 * Where a group analysis's numbers come from: its fit setting and fits, the
 * embryos left out and why, and any model AICc prefers over the one used.
 */
export function analysisInputsNotice(r: AnalysisInputs & { analysis_id: number }): HTMLElement {
  return el(
    "div",
    { class: "analysis-inputs", "data-role": "analysis-inputs" },
    r.fit_setting
      ? infoNotice(
          el("strong", {}, "Fits. "),
          `Fit setting `,
          el("span", { "data-role": "fit-setting" }, r.fit_setting.name),
          ` (${r.fit_setting.description}) — ${r.fit_setting_chosen ?? ""}. `,
          `${r.fit_ids?.length ?? 0} fits used${r.fitted_now ? `, ${r.fitted_now} of them fitted now with this setting` : ""}. `,
          el("details", {}, el("summary", {}, "Fit ids (re-run from them with the API field fitIds)"), el("p", { "data-role": "fit-ids" }, (r.fit_ids ?? []).join(", "))),
        )
      : null,
    el(
      "div",
      { "data-role": "left-out" },
      r.left_out && r.left_out.length
        ? infoNotice(el("strong", {}, "Left out (excluded). "), r.left_out.map(leftOutText).join("; "), ".")
        : r.left_out
          ? el("p", { class: "hint" }, "No embryo was left out.")
          : null,
    ),
    el("p", {}, el("a", { class: "btn btn-secondary", href: csvExportUrl("inputs", { analysis: r.analysis_id }), download: "", "data-role": "csv-inputs" }, "Download the profiles, fit ids and left-out embryos (CSV)")),
    ...(r.model_preference?.warnings ?? []).map((w) => warningNotice(w, "Choose the fits with the fit setting and model fields above; “best” uses one model, chosen by AICc summed over all groups, for every group.")),
  );
}
