import type { ChartConfiguration } from "chart.js";
import type { Parameter } from "../../api/types/estimate.ts";
import type { FitDetail } from "../../api/types/fits.ts";
import { chartPanel } from "../../components/chartPanel.ts";
import { el } from "../../components/el.ts";
import { infoNotice, warningNotice } from "../../components/notice.ts";
import { excludeButton } from "../../components/exclusionControls.ts";
import { profileFitFigure, residualFigure } from "../../figures/index.ts";
import { formatEstimate, formatEstimateInterval } from "../../format/formatEstimate.ts";
import { fixed, formatSignificant } from "../../format/significant.ts";

/** Readable names of the parameters and derived quantities the API reports. */
const NAMES: Record<string, string> = {
  lambdaUm: "decay length λ",
  amplitude: "amplitude A",
  background: "background B",
  sourceWidthUm: "source width s",
  x0Um: "offset x₀",
  exponent: "exponent m",
  diffusionOverDegradationUm2: "D/k = λ²",
  lambdaFractionOfLength: "λ / embryo length",
};

function parameterRows(params: Record<string, Parameter>, kind: string): HTMLElement[] {
  return Object.entries(params).map(([name, p]) =>
    el(
      "tr",
      { "data-parameter": name },
      el("td", {}, NAMES[name] ?? name, p.fixed ? " (held fixed)" : ""),
      el("td", {}, kind),
      el("td", { class: "num" }, formatEstimate(p)),
      el("td", { class: "num" }, formatEstimateInterval(p)),
      el("td", {}, p.unit || "—"),
    ),
  );
}

/**
 * One fit in full: the profile with its fitted curve on linear and semi-log
 * axes, the residuals, the parameters with SE and 95% CI, and what they mean.
 */
export function fitDetail(fit: FitDetail): HTMLElement {
  const f = fit.result.fit;
  const label = fit.profile ? `${fit.profile.embryo} (${fit.profile.genotype}, ${fit.profile.channel})` : `fit ${fit.id}`;
  const figure = (title: string, config: ChartConfiguration, kind: string, extra: Record<string, string> = {}) =>
    chartPanel(title, config, { kind, query: { fit: fit.id, ...extra } });
  const params = el(
    "table",
    { class: "data compact", "data-role": "fit-parameters" },
    el("caption", {}, `Parameters of the ${f.model} fit`),
    el("thead", {}, el("tr", {}, ...["Quantity", "Kind", "Value ± SE", "95% CI", "Unit"].map((h) => el("th", { scope: "col" }, h)))),
    el("tbody", {}, ...parameterRows(f.parameters ?? {}, "fitted"), ...parameterRows(f.derived ?? {}, "derived")),
  );
  const warnings = (f.warnings ?? []).map((w) => warningNotice(typeof w === "string" ? w : w.message));
  const flag = f.status !== "converged" ? `fit ${f.status}` : warnings.length ? `fit warning: ${String(typeof f.warnings![0] === "string" ? f.warnings![0] : f.warnings![0].message)}` : "";
  const exclusion = el("p", { "data-role": "fit-exclusion" });
  if (fit.profile) {
    const embryo = fit.profile.embryo;
    exclusion.append(
      flag ? `${embryo} is flagged (${flag}). ` : "",
      excludeButton({ embryo }, () => exclusion.replaceChildren(el("span", { class: "hint" }, `${embryo} is excluded: group analyses and precision leave it out from their next run.`)), flag ? `flagged in Fits (${flag})` : "", fit.profile.channel),
    );
  }
  return el(
    "div",
    { class: "fit-detail", "data-fit-id": String(fit.id) },
    el("h3", {}, `${label}: ${f.model} fit — ${f.status}`),
    el("p", { class: "muted" }, `${f.message}. ${f.n} points; R² = ${formatSignificant(f.r2, 4)}; residual SD = ${formatSignificant(f.residualSd, 3)} a.u.; AICc = ${f.aicc === null ? "—" : fixed(f.aicc, 1)}.`),
    el("p", { class: "muted", "data-role": "fit-window" }, `Window: ${f.window ? f.window.description : "not recorded (fit stored by an earlier version)"}.`),
    el("p", { class: "muted", "data-role": "fit-error-model" }, `Error model: ${fit.errorModel.description}.`),
    ...warnings,
    exclusion,
    el(
      "div",
      { class: "columns" },
      figure(`${label}: data and fitted curve, linear axes`, profileFitFigure(fit, "linear"), "profile-fit"),
      figure(`${label}: data and fitted curve, semi-log axes`, profileFitFigure(fit, "log"), "profile-fit", { scale: "log" }),
    ),
    el("div", { class: "columns" }, figure(`${label}: residuals`, residualFigure(fit), "residuals"), el("div", {}, params, infoNotice(fit.caveat))),
  );
}
