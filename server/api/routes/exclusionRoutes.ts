import { z } from "zod";
import { ExcludeRequest, IncludeRequest } from "../../services/exclusions/exclusionRequest.ts";
import { excludeEmbryo, exclusionOverview, includeEmbryo } from "../../services/exclusions/exclusionService.ts";
import { fitSettingsOverview } from "../../services/fits/fitSettings.ts";
import { defineRoute } from "../route.ts";

export const exclusionRoutes = [
  defineRoute({
    method: "get",
    path: "/api/fit-settings",
    tag: "fits",
    summary: "Stored fit settings (model, window, weights, background, fixed parameters) with, per genotype, how many profiles have a fit under each",
    query: z.object({ channel: z.string().min(1).optional() }),
    handler: ({ db, query }) => fitSettingsOverview(db, { channel: query.channel }),
  }),
  defineRoute({
    method: "get",
    path: "/api/exclusions",
    tag: "exclusions",
    summary: "Embryos and profiles excluded now, with their reasons, and the whole history of exclusions and inclusions",
    handler: ({ db }) => exclusionOverview(db),
  }),
  defineRoute({
    method: "post",
    path: "/api/exclusions",
    tag: "exclusions",
    summary: "Exclude an embryo (or one channel's profile of it) from group analyses and precision, with a reason; it stays stored",
    body: ExcludeRequest,
    status: 201,
    handler: ({ db, body }) => excludeEmbryo(db, body),
  }),
  defineRoute({
    method: "post",
    path: "/api/inclusions",
    tag: "exclusions",
    summary: "Include an excluded embryo (or profile) again; the history keeps both",
    body: IncludeRequest,
    handler: ({ db, body }) => includeEmbryo(db, body),
  }),
];
