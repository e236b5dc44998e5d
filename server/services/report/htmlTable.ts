import { escapeHtml } from "./escapeHtml.ts";

/** A table of text cells (escaped here); numbers right-aligned by the "num" class of their column. */
export function htmlTable(columns: string[], rows: (string | number | null | undefined)[][], numeric: boolean[] = []): string {
  const cls = (i: number) => (numeric[i] ? ' class="num"' : "");
  const cell = (v: string | number | null | undefined) => escapeHtml(v === null || v === undefined ? "—" : String(v));
  return `<table><thead><tr>${columns.map((c, i) => `<th${cls(i)}>${escapeHtml(c)}</th>`).join("")}</tr></thead><tbody>${rows
    .map((r) => `<tr>${r.map((v, i) => `<td${cls(i)}>${cell(v)}</td>`).join("")}</tr>`)
    .join("")}</tbody></table>`;
}
