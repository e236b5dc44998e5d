import type { ChartConfiguration } from "chart.js";
import { FIGURE_REGISTRY, type FigureKind } from "../../../client/figures/figureRegistry.ts";
import type { IntensityScale } from "../../../client/figures/profileFitFigure.ts";
import type { FigureConfig } from "../../../client/figures/scatterConfig.ts";
import type { Db } from "../../../db/connection.ts";
import { getAnalysis } from "../../../db/analyses.ts";
import { profileFitFigure } from "../../../client/figures/profileFitFigure.ts";
import { residualFigure } from "../../../client/figures/residualFigure.ts";
import { groupValuesFigure } from "../../../client/figures/groupValuesFigure.ts";
import { trendFigure } from "../../../client/figures/trendFigure.ts";
import { powerFigure } from "../../../client/figures/powerFigure.ts";
import { renderChart } from "../../figures/renderChart.ts";
import { UserError } from "../../userError.ts";
import { analysisResponse } from "../analyses/analysisResponse.ts";
import { fitResponse } from "../fits/fitResponse.ts";
import { precisionChannel } from "../precision/precisionChannel.ts";
import { fileNamePart } from "./fileNamePart.ts";

export interface FigureRequest {
  kind: FigureKind;
  /** Stored fit id, for the fit figures. */
  fit?: number;
  /** Stored analysis id, for the others. */
  analysis?: number;
  /** Channel of a multi-channel precision analysis (the first by default). */
  channel?: string;
  scale: IntensityScale;
}

export interface BuiltFigure {
  config: FigureConfig;
  /** File name without extension: kind, what it shows and the source id. */
  baseName: string;
}

/**
 * Rebuild the JSON the API answered for the stored fit or analysis and draw
 * the figure from it with the same builder the browser uses. 404 for an
 * unknown id; 400 when the figure is not drawn from that kind of source.
 */
export function storedFigure(db: Db, request: FigureRequest): BuiltFigure {
  const { kind } = request;
  const entry = FIGURE_REGISTRY[kind];
  const use = `the ${kind} figure`;
  if (entry.source === "fit") {
    if (request.fit === undefined) throw new UserError("wrong-source", `The ${kind} figure is drawn from a stored fit: give fit=ID (not analysis=ID).`, { status: 400, issues: [{ path: "query.fit", message: "required for this figure" }] });
    const fit = fitResponse(db, request.fit);
    const config = kind === "profile-fit" ? profileFitFigure(fit, request.scale) : residualFigure(fit);
    const who = fit.profile ? `${fit.profile.embryo}_${fit.profile.channel}` : "profile";
    return { config, baseName: [kind, who, fit.model, `fit${fit.id}`, kind === "profile-fit" && request.scale === "log" ? "log" : ""].filter(Boolean).map(fileNamePart).join("_") };
  }
  if (request.analysis === undefined) throw new UserError("wrong-source", `The ${kind} figure is drawn from a stored analysis: give analysis=ID (not fit=ID).`, { status: 400, issues: [{ path: "query.analysis", message: "required for this figure" }] });
  const id = request.analysis;
  const name = (label: string) => [kind, label, `analysis${id}`].map(fileNamePart).join("_");
  switch (entry.source) {
    case "precision": {
      const p = precisionChannel(analysisResponse(db, id, "precision", use), request.channel);
      const builder = FIGURE_REGISTRY[kind].builder as (input: typeof p) => FigureConfig;
      return { config: builder(p), baseName: name(`${p.group}_${p.channel}`) };
    }
    case "comparison": {
      const c = analysisResponse(db, id, "comparison", use);
      return { config: groupValuesFigure(c), baseName: name(`${c.metric}-by-${c.by}_${c.channel}`) };
    }
    case "tracking": {
      const t = analysisResponse(db, id, "tracking", use);
      return { config: trendFigure(t), baseName: name(`${t.over}_${t.channel}`) };
    }
    case "plan": {
      const p = analysisResponse(db, id, "plan", use);
      return { config: powerFigure(p), baseName: name(`${p.metric}${p.group ? `_${p.group}` : ""}`) };
    }
    case "dynamics":
    case "frap":
    case "simulation": {
      const a = getAnalysis(db, id);
      if (!a) throw new UserError("not-found", `No stored analysis has id ${id}.`, { status: 404 });
      if (a.kind !== entry.source && !(kind === "accumulation-time" && a.kind === "combine")) throw new UserError("wrong-source", `Analysis ${id} is a ${a.kind} analysis; ${use} needs a ${entry.source} analysis.`, { status: 400, issues: [{ path: "query.analysis", message: `expected ${entry.source}, got ${a.kind}` }] });
      const input = { ...(a.result as object), analysis_id: id };
      const builder = entry.builder as (i: unknown) => FigureConfig;
      const g = input as unknown as { genotype?: string; channel?: string };
      const label = a.kind === "dynamics" ? `${g.genotype}_${g.channel}` : a.kind;
      return { config: builder(input), baseName: name(label) };
    }
  }
}

/** Render a built figure to PNG (at `dpi`) or SVG. */
export function renderFigure(figure: BuiltFigure, format: "png" | "svg", dpi: number): { body: Buffer; contentType: string; fileName: string } {
  return {
    body: renderChart(figure.config as unknown as ChartConfiguration, { format, dpi }),
    contentType: format === "png" ? "image/png" : "image/svg+xml",
    fileName: `${figure.baseName}.${format}`,
  };
}
