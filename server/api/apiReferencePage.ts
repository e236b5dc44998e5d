import { createHash } from "node:crypto";

/** A readable HTML page of the OpenAPI document (no scripts, everything escaped). */
export function apiReferencePage(doc: Record<string, unknown>): string {
  const esc = (s: unknown) => String(s ?? "").replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);
  const info = doc.info as { title: string; version: string; description: string };
  const paths = doc.paths as Record<string, Record<string, { summary: string; description?: string; tags: string[]; parameters: { name: string; in: string; required: boolean; description?: string; schema: Record<string, unknown> }[]; requestBody?: { content: Record<string, { schema: unknown }> } }>>;
  const byTag = new Map<string, string[]>();
  for (const [path, ops] of Object.entries(paths)) {
    for (const [method, op] of Object.entries(ops)) {
      const params = op.parameters.length
        ? `<table><tr><th>parameter</th><th>in</th><th>type</th><th>description</th></tr>${op.parameters
            .map((p) => `<tr><td><code>${esc(p.name)}</code>${p.required ? " *" : ""}</td><td>${esc(p.in)}</td><td>${esc(typeLabel(p.schema))}</td><td>${esc(p.description ?? "")}</td></tr>`)
            .join("")}</table>`
        : "";
      const body = op.requestBody
        ? Object.entries(op.requestBody.content)
            .map(([type, c]) => `<details><summary>request body (${esc(type)})</summary><pre>${esc(JSON.stringify(c.schema, null, 2))}</pre></details>`)
            .join("")
        : "";
      const html = `<section><h3><span class="m ${esc(method)}">${esc(method.toUpperCase())}</span> <code>${esc(path)}</code></h3><p>${esc(op.summary)}</p>${op.description ? `<p class="d">${esc(op.description)}</p>` : ""}${params}${body}</section>`;
      const tag = op.tags[0] ?? "other";
      byTag.set(tag, [...(byTag.get(tag) ?? []), html]);
    }
  }
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${esc(info.title)} reference</title>
<style>body{font-family:"DejaVu Sans",system-ui,sans-serif;max-width:60rem;margin:2rem auto;padding:0 1rem;color:#1d232b}
code,pre{font-family:"DejaVu Sans Mono",monospace}pre{background:#f3f3ee;padding:.5rem;overflow:auto;font-size:.8rem}
table{border-collapse:collapse;margin:.5rem 0}td,th{border:1px solid #ccc;padding:.2rem .5rem;text-align:left;font-size:.9rem}
.m{display:inline-block;min-width:4.5rem;padding:.1rem .3rem;border-radius:3px;color:#fff;font-size:.8rem;text-align:center}
.get{background:#2a6f97}.post{background:#4d7c0f}.delete{background:#a4343a}section{border-top:1px solid #ddd;padding:.3rem 0}.d{color:#555}</style></head>
<body><h1>${esc(info.title)} <small>${esc(info.version)}</small></h1><p>${esc(info.description)}</p>
<p>Machine-readable: <a href="openapi.json">openapi.json</a> (OpenAPI 3.1). Errors always come as <code>{"error": {"code", "message", "issues": [{"path", "message"}]}}</code>.</p>
${[...byTag].map(([tag, items]) => `<h2>${esc(tag)}</h2>${items.join("")}`).join("")}</body></html>`;
}

function typeLabel(schema: Record<string, unknown>): string {
  if (Array.isArray(schema.enum)) return schema.enum.join(" | ");
  if (typeof schema.type === "string") return schema.type;
  return "";
}

/** The reference page's own policy: no scripts at all, and only its one inline style block, by hash. */
export function apiReferencePolicy(page: string): string {
  const style = /<style>([\s\S]*?)<\/style>/.exec(page)?.[1] ?? "";
  const hash = createHash("sha256").update(style).digest("base64");
  return `default-src 'self'; script-src 'none'; style-src 'sha256-${hash}'; object-src 'none'; frame-ancestors 'none'; base-uri 'self'`;
}
