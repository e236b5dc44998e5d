import { z } from "zod";
import { FIGURE_KINDS } from "../../../client/figures/figureRegistry.ts";
import { renderFigure, storedFigure } from "../../services/figures/storedFigure.ts";
import { defineRoute } from "../route.ts";

const id = z.coerce.number().int().positive();

export const FigureQuery = z
  .object({
    fit: id.optional().describe("Stored fit id (profile-fit, residuals)."),
    analysis: id.optional().describe("Stored analysis id (every other figure)."),
    channel: z.string().min(1).optional().describe("Channel of a multi-channel precision analysis; the first by default."),
    format: z.enum(["png", "svg"]).default("png").describe("png (raster at dpi) or svg (vector, 650 × 400)."),
    scale: z.enum(["linear", "log"]).default("linear").describe("Intensity axis of profile-fit: log shows an exponential as a straight line."),
    dpi: z.coerce.number().int().min(50).max(600).default(300).describe("PNG resolution; the figure is 6.5 × 4 inches (1950 × 1200 px at 300 dpi)."),
  })
  .refine((q) => (q.fit === undefined) !== (q.analysis === undefined), { message: "give exactly one source: fit=ID or analysis=ID", path: ["fit"] });

export const figureRoutes = [
  defineRoute({
    method: "get",
    path: "/api/figures/:kind",
    tag: "figures",
    summary: "A publication figure of a stored fit or analysis as PNG or SVG (the same figure the page draws)",
    description: `Kinds: ${FIGURE_KINDS.join(", ")}. profile-fit and residuals take fit=ID; group-values a comparison, ensemble, sigma-x, boundary and decoding-map a precision analysis, trend a tracking analysis and power a sample-size plan (analysis=ID). Answered as a download.`,
    params: z.object({ kind: z.enum(FIGURE_KINDS) }),
    query: FigureQuery,
    produces: "image/png",
    handler({ db, params, query, res }) {
      const figure = storedFigure(db, { kind: params.kind, fit: query.fit, analysis: query.analysis, channel: query.channel, scale: query.scale });
      const { body, contentType, fileName } = renderFigure(figure, query.format, query.dpi);
      res.status(200).set({ "content-type": contentType, "content-disposition": `attachment; filename="${fileName}"` }).send(body);
      return undefined;
    },
  }),
];
