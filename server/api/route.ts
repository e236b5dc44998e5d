import type { Request, Response } from "express";
import { z } from "zod";
import type { Db } from "../../db/connection.ts";
import type { JobRunner } from "../jobs/jobRunner.ts";
import type { DataSets } from "../services/datasets/dataSets.ts";

/** What every handler receives: validated request parts and the app's services. */
export interface RouteContext<Q, B, P> {
  query: Q;
  body: B;
  params: P;
  /** The open data set's database. */
  db: Db;
  /** The data sets the server can switch between; null when it was started on one database only. */
  datasets: DataSets | null;
  jobs: JobRunner;
  req: Request;
  res: Response;
}

export interface RouteDefinition<Q extends z.ZodType = z.ZodType, B extends z.ZodType = z.ZodType, P extends z.ZodType = z.ZodType> {
  method: "get" | "post" | "delete";
  /** Express path, e.g. /api/profiles/:id */
  path: string;
  summary: string;
  description?: string;
  tag: string;
  query?: Q;
  body?: B;
  params?: P;
  /** Schema of a 200 JSON answer, for the reference; omitted for files and streams. */
  response?: z.ZodType;
  /** Content type when the answer is not JSON (e.g. "image/png", "text/csv"). */
  produces?: string;
  /** Request body sent as multipart/form-data (file uploads), described for the reference. */
  multipart?: { fields: Record<string, string> };
  /** Status code of a successful answer (200 unless set). */
  status?: number;
  /**
   * Returns the JSON answer, or undefined when it wrote the response itself
   * (streams, files).
   */
  handler: (ctx: RouteContext<z.output<Q>, z.output<B>, z.output<P>>) => unknown | Promise<unknown>;
}

/** Declare a route; the generic parameters carry the schemas' types into the handler. */
export function defineRoute<Q extends z.ZodType = z.ZodUnknown, B extends z.ZodType = z.ZodUnknown, P extends z.ZodType = z.ZodUnknown>(
  def: RouteDefinition<Q, B, P>,
): RouteDefinition {
  return def as unknown as RouteDefinition;
}

/** Path parameter holding a positive integer id. */
export const IdParams = z.object({ id: z.coerce.number().int().positive() });
