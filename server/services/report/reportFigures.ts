import { boundaryFigure } from "../../../client/figures/boundaryFigure.ts";
import { decodingMapFigure } from "../../../client/figures/decodingMapFigure.ts";
import { ensembleFigure } from "../../../client/figures/ensembleFigure.ts";
import type { FigureKind } from "../../../client/figures/figureRegistry.ts";
import { groupValuesFigure } from "../../../client/figures/groupValuesFigure.ts";
import { powerFigure } from "../../../client/figures/powerFigure.ts";
import { profileFitFigure } from "../../../client/figures/profileFitFigure.ts";
import { residualFigure } from "../../../client/figures/residualFigure.ts";
import type { FigureConfig } from "../../../client/figures/scatterConfig.ts";
import { sigmaXFigure } from "../../../client/figures/sigmaXFigure.ts";
import { trendFigure } from "../../../client/figures/trendFigure.ts";
import { fileNamePart } from "../figures/fileNamePart.ts";
import type { ReportData } from "./gatherReport.ts";

/** One figure of the report: where it belongs, its file name (without extension) and what it shows. */
export interface ReportFigure {
  /** Section key it is shown in: "group:<genotype>/<channel>", "comparison:<id>", "tracking:<id>" or "plan:<id>". */
  section: string;
  kind: FigureKind;
  baseName: string;
  caption: string;
  config: FigureConfig;
}

const base = (kind: string, label: string, source: string) => [kind, label, source].map(fileNamePart).join("_");

/** Every figure the report draws, built by the same builders as the page and the figure endpoint. */
export function reportFigures(data: ReportData): ReportFigure[] {
  const out: ReportFigure[] = [];
  for (const g of data.groups) {
    const section = `group:${g.genotype}/${g.channel}`;
    const label = `${g.genotype}_${g.channel}`;
    if (g.example) {
      const fit = g.example;
      const who = `embryo ${fit.profile?.embryo ?? "?"} (the converged exponential fit with the median λ of the group)`;
      out.push(
        { section, kind: "profile-fit", baseName: base("profile-fit", `${label}_${fit.profile?.embryo ?? ""}`, `fit${fit.id}`), caption: `Profile and fitted exponential, ${who}.`, config: profileFitFigure(fit, "linear") },
        { section, kind: "profile-fit", baseName: base("profile-fit", `${label}_${fit.profile?.embryo ?? ""}`, `fit${fit.id}_log`), caption: `The same on a logarithmic intensity axis, where an exponential decay is a straight line.`, config: profileFitFigure(fit, "log") },
        { section, kind: "residuals", baseName: base("residuals", `${label}_${fit.profile?.embryo ?? ""}`, `fit${fit.id}`), caption: `Residuals of that fit; a systematic bend means the model misses the shape.`, config: residualFigure(fit) },
      );
    }
    if (g.precision) {
      const p = g.precision.response;
      const src = `analysis${p.analysis_id}`;
      out.push(
        { section, kind: "ensemble", baseName: base("ensemble", label, src), caption: "Mean profile ± one SD across embryos on the analysis grid.", config: ensembleFigure(p) },
        { section, kind: "sigma-x", baseName: base("sigma-x", label, src), caption: "Positional error σ_x(x) = σ_c/|dc̄/dx| with its bootstrap 95% band; gaps are masked positions.", config: sigmaXFigure(p) },
        { section, kind: "boundary", baseName: base("boundary", label, src), caption: "Each embryo's boundary position at the common threshold, ranked, with mean ± SD.", config: boundaryFigure(p) },
      );
      if (p.decoding) out.push({ section, kind: "decoding-map", baseName: base("decoding-map", label, src), caption: "Decoding map: where each true position is decoded from the concentration; a perfect readout lies on the diagonal.", config: decodingMapFigure(p) });
    }
  }
  for (const c of data.comparisons) {
    const r = c.response;
    out.push({ section: `comparison:${r.analysis_id}`, kind: "group-values", baseName: base("group-values", `${r.metric}-by-${r.by}_${r.channel}`, `analysis${r.analysis_id}`), caption: "Per-embryo values (points) and group estimates with 95% CI.", config: groupValuesFigure(r) });
  }
  for (const t of data.trackings) {
    const r = t.response;
    out.push({ section: `tracking:${r.analysis_id}`, kind: "trend", baseName: base("trend", `${r.over}_${r.channel}`, `analysis${r.analysis_id}`), caption: `Tracking over ${r.over}.`, config: trendFigure(r) });
  }
  for (const p of data.plans) {
    const r = p.response;
    out.push({ section: `plan:${r.analysis_id}`, kind: "power", baseName: base("power", `${r.metric}${r.group ? `_${r.group}` : ""}`, `analysis${r.analysis_id}`), caption: "Power against embryos per group, exact and simulated.", config: powerFigure(r) });
  }
  return out;
}
