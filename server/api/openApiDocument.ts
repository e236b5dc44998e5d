import { z } from "zod";
import type { RouteDefinition } from "./route.ts";

const ErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    issues: z.array(z.object({ path: z.string(), message: z.string() })),
  }),
});

function jsonSchema(schema: z.ZodType, io: "input" | "output"): Record<string, unknown> {
  return z.toJSONSchema(schema, { io, unrepresentable: "any", target: "draft-2020-12" }) as Record<string, unknown>;
}

/** OpenAPI 3.1 document generated from the same zod schemas that validate each request. */
export function openApiDocument(routes: RouteDefinition[], version: string): Record<string, unknown> {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const r of routes) {
    const path = r.path.replace(/:([A-Za-z_]+)/g, "{$1}");
    const parameters: unknown[] = [];
    for (const [where, schema] of [["path", r.params], ["query", r.query]] as const) {
      if (!schema) continue;
      const js = jsonSchema(schema, "input") as { properties?: Record<string, Record<string, unknown>>; required?: string[] };
      for (const [name, prop] of Object.entries(js.properties ?? {})) {
        parameters.push({
          name,
          in: where,
          required: where === "path" || (js.required ?? []).includes(name),
          description: prop.description,
          schema: prop,
        });
      }
    }
    const op: Record<string, unknown> = {
      summary: r.summary,
      description: r.description,
      tags: [r.tag],
      parameters,
      responses: {
        [String(r.status ?? 200)]: r.produces
          ? { description: r.produces, content: { [r.produces]: {} } }
          : { description: "OK", content: { "application/json": { schema: r.response ? jsonSchema(r.response, "output") : {} } } },
        "4XX": { description: "A mistake in the request, explained in `error.message`", content: { "application/json": { schema: jsonSchema(ErrorSchema, "output") } } },
      },
    };
    if (r.body) op.requestBody = { required: true, content: { "application/json": { schema: jsonSchema(r.body, "input") } } };
    if (r.multipart) {
      op.requestBody = {
        required: true,
        content: {
          "multipart/form-data": {
            schema: { type: "object", properties: Object.fromEntries(Object.entries(r.multipart.fields).map(([k, d]) => [k, { type: "string", description: d }])) },
          },
        },
      };
    }
    (paths[path] ??= {})[r.method] = op;
  }
  return {
    openapi: "3.1.0",
    info: {
      title: "morphogauge API",
      version,
      description:
        "JSON API of the morphogauge lab server: import intensity profiles, fit synthesis–diffusion–degradation models, estimate positional error and positional information, compare groups and draw figures. Lengths in µm, times in s, intensities in a.u.",
    },
    paths,
  };
}
