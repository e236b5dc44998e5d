import { toCsv, type CsvCell } from "../format/toCsv.ts";
import { el, type Child } from "./el.ts";

export interface Column<T> {
  /** Header text, with the unit: "λ (µm)". */
  header: string;
  cell: (row: T) => Child;
  /** Value written to the CSV; the cell's text when absent. */
  csv?: (row: T) => CsvCell;
  /** Numbers are right-aligned. */
  numeric?: boolean;
}

export interface TableOptions<T> {
  caption: string;
  columns: Column<T>[];
  rows: T[];
  /** A server export of the same table (preferred), or a file name for a CSV of exactly what the table shows. */
  csv: { href: string } | { fileName: string };
  /** Makes rows selectable by click, Enter or Space; `rowLabel` names the row for screen readers. */
  onActivate?: (row: T, tr: HTMLTableRowElement) => void;
  rowLabel?: (row: T) => string;
  /** Rows starting a new group get a heading row with this text. */
  groupBy?: (row: T) => string;
  /** data-* attribute values on each row, for styling and tests. */
  rowData?: (row: T) => Record<string, string>;
  empty?: string;
}

function textOf(child: Child): string {
  if (child === null || child === undefined || child === false) return "";
  if (typeof child === "string" || typeof child === "number") return String(child);
  return child.textContent ?? "";
}

/** A table with a caption and an export link: from the server when it has the table, otherwise a CSV built from the cells. */
export function dataTable<T>(options: TableOptions<T>): HTMLElement {
  const { columns, rows } = options;
  const head = el("tr", {}, ...columns.map((c) => el("th", { scope: "col", class: c.numeric ? "num" : null }, c.header)));
  const body = el("tbody");
  let group: string | null = null;
  for (const row of rows) {
    if (options.groupBy) {
      const g = options.groupBy(row);
      if (g !== group) {
        group = g;
        body.append(el("tr", { class: "group-row" }, el("th", { colspan: columns.length, scope: "colgroup" }, g)));
      }
    }
    const tr = el("tr", {}, ...columns.map((c) => el("td", { class: c.numeric ? "num" : null }, c.cell(row))));
    for (const [k, v] of Object.entries(options.rowData?.(row) ?? {})) tr.dataset[k] = v;
    if (options.onActivate) {
      const activate = () => options.onActivate!(row, tr);
      tr.tabIndex = 0;
      tr.classList.add("selectable");
      if (options.rowLabel) tr.setAttribute("aria-label", options.rowLabel(row));
      tr.addEventListener("click", activate);
      tr.addEventListener("keydown", (e) => {
        if (e.key === "Enter" || e.key === " ") {
          e.preventDefault();
          activate();
        }
      });
    }
    body.append(tr);
  }
  if (rows.length === 0) body.append(el("tr", {}, el("td", { colspan: columns.length, class: "empty" }, options.empty ?? "Nothing to show.")));

  const table = el("table", { class: "data" }, el("caption", {}, options.caption), el("thead", {}, head), body);
  return el("div", { class: "table-block" }, el("div", { class: "table-scroll" }, table), el("div", { class: "table-actions" }, csvLink(options)));
}

function csvLink<T>(options: TableOptions<T>): HTMLAnchorElement {
  if ("href" in options.csv) return el("a", { class: "btn btn-secondary", href: options.csv.href, download: "", "data-role": "csv" }, "Download CSV");
  const fileName = options.csv.fileName;
  const link = el("a", { class: "btn btn-secondary", href: "#", download: fileName, "data-role": "csv" }, "Download CSV");
  // Built on demand, so the file holds the table as it is when the user asks.
  link.addEventListener("click", () => {
    const header = options.columns.map((c) => c.header);
    const data = options.rows.map((r) => options.columns.map((c) => (c.csv ? c.csv(r) : textOf(c.cell(r)))));
    if (link.href.startsWith("blob:")) URL.revokeObjectURL(link.href);
    link.href = URL.createObjectURL(new Blob([toCsv(header, data)], { type: "text/csv" }));
  });
  return link;
}
