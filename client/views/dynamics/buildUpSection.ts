import type { Choices } from "../../api/fetchChoices.ts";
import { apiPost } from "../../api/http.ts";
import type { JobView } from "../../api/types/job.ts";
import type { TimeCourseGroup } from "../../api/types/dynamics.ts";
import { chartPanel, destroyCharts } from "../../components/chartPanel.ts";
import { el, replaceChildren } from "../../components/el.ts";
import { button, field, numberInput, numberValue, select } from "../../components/formFields.ts";
import { runJob } from "../../components/jobProgress.ts";
import { infoNotice, warningNotice } from "../../components/notice.ts";
import { accumulationTimeFigure, buildUpFigure, buildUpResidualFigure, dkRegionFigure, profileLikelihoodFigure } from "../../figures/index.ts";
import { quantityTiles } from "./quantityTiles.ts";

function groupResult(g: TimeCourseGroup): HTMLElement {
  const head = el("h3", {}, `${g.genotype} / ${g.channel}: ${g.n_profiles} profiles at ${g.times_s.length} times`);
  if (g.status !== "ok") return el("div", { class: "result-block" }, head, warningNotice(g.message));
  const [lo, hi] = g.profile_interval_k ?? [null, null];
  const source = { kind: "", query: { analysis: g.analysis_id } };
  return el(
    "div",
    { class: "result-block", "data-role": "build-up-result" },
    head,
    quantityTiles(g, [
      { label: "correlation of D and k", value: g.correlation_D_k === null ? "—" : g.correlation_D_k.toFixed(2), key: "corr" },
      { label: "k, profile-likelihood 95% interval (1/s)", value: `[${lo === null ? "open" : lo.toPrecision(3)}, ${hi === null ? "open" : hi.toPrecision(3)}]`, key: "k-profile" },
      ...(g.source_strength ? [{ label: `source strength (${g.source_strength.unit})`, value: g.source_strength.value.toPrecision(4), key: "j0" }] : []),
    ]),
    ...g.warnings.map((w) => warningNotice(w)),
    infoNotice(g.caveat),
    el(
      "div",
      { class: "chart-grid" },
      chartPanel("Build-up with the joint fit", buildUpFigure(g), { ...source, kind: "build-up" }),
      chartPanel("Residuals", buildUpResidualFigure(g), { ...source, kind: "build-up-residuals" }),
      chartPanel("Profile likelihood of k", profileLikelihoodFigure(g), { ...source, kind: "profile-likelihood-k" }, "D is re-fitted at each k; a curve that stays under the dashed line on one side means k is not identified."),
      chartPanel("D and k jointly", dkRegionFigure(g), { ...source, kind: "dk-region" }, "A region stretched along the dotted line λ = √(D/k) means the data fix λ but not D and k separately."),
      chartPanel("Local accumulation time", accumulationTimeFigure(g), { ...source, kind: "accumulation-time" }),
    ),
  );
}

/** Fit D, k and the source strength to stored profiles that carry a time. */
export function buildUpSection(choices: Choices): HTMLElement {
  const genotype = select("genotype", [["", "all"], ...choices.genotypes.map((g): [string, string] => [g, g])]);
  const channel = select("channel", [["", "all"], ...choices.channels.map((c): [string, string] => [c, c])], choices.channels.includes("glm-gfp") ? "glm-gfp" : "");
  const length = numberInput("length", "", { min: 0, placeholder: "semi-infinite" });
  const width = numberInput("source-width", "", { min: 0, placeholder: "influx at x = 0" });
  const out = el("div", { "data-role": "build-up-results" });
  const run = async () => {
    destroyCharts(out);
    const options: Record<string, unknown> = {};
    const L = numberValue(length);
    const s = numberValue(width);
    if (L !== undefined) options.domain = { kind: "finite", lengthUm: L };
    if (s !== undefined) options.source = { kind: "region", widthUm: s };
    const selection = { ...(genotype.value ? { genotype: genotype.value } : {}), ...(channel.value ? { channel: channel.value } : {}) };
    const r = await runJob<{ groups: TimeCourseGroup[] }>(out, "Fitting the build-up", () => apiPost<JobView>("api/dynamics/time-course", { selection, options }));
    if (r) replaceChildren(out, ...r.groups.map(groupResult));
  };
  return el(
    "section",
    { class: "panel", "aria-labelledby": "build-up-title", "data-section": "build-up" },
    el("h2", { id: "build-up-title" }, "Build-up over time: D and k from a time course"),
    el("p", {}, "Fits every selected profile that has a time (seconds since the source switched on) jointly. A steady-state profile alone gives only λ = √(D/k)."),
    el("div", { class: "form-row" }, field("Genotype", genotype), field("Channel", channel), field("Domain length (µm)", length, "closed far end; empty for a long tissue"), field("Source width (µm)", width, "production region; empty for an influx")),
    button("Fit build-up", () => void run(), "primary", { "data-role": "fit-build-up" }),
    out,
  );
}
