import type { DatabaseComparison, FieldDifference, ImportWarning, PreviewFile } from "../../api/types/imports.ts";
import { el } from "../../components/el.ts";
import { warningNotice } from "../../components/notice.ts";
import { browserWording } from "../../format/browserWording.ts";
import { formatPlain } from "../../format/significant.ts";

const SEPARATOR_NAMES: Record<string, string> = { ",": "comma", ";": "semicolon", "\t": "tab" };
const DECIMAL_NAMES: Record<string, string> = { ".": "point", ",": "comma" };
const UNIT_NAMES: Record<string, string> = { um: "µm", px: "px", fraction: "x/L" };

/** Name/value pairs as a definition list. */
function facts(pairs: [string, string][]): HTMLElement {
  return el("dl", { class: "facts" }, ...pairs.flatMap(([k, v]) => [el("dt", {}, k), el("dd", {}, v)]));
}

export function warningList(warnings: ImportWarning[]): HTMLElement | null {
  if (!warnings.length) return null;
  return el("div", { class: "warnings" }, ...warnings.map((w) => warningNotice(browserWording(w.message), browserWording(w.hint))));
}

/** What the importer read from one file, before anything is stored; or why it would refuse it. */
export function previewCard(p: PreviewFile): HTMLElement {
  if (p.status === "rejected") {
    return el(
      "article",
      { class: "preview-card rejected", "data-file": p.file, "data-status": "rejected" },
      el("h3", {}, p.file, " ", el("span", { class: "badge badge-bad" }, "will be rejected")),
      el("p", {}, browserWording(p.error.message)),
      p.error.issues.length > 1 ? el("ul", { class: "issues" }, ...p.error.issues.map((i) => el("li", {}, browserWording(`${i.path}: ${i.message}`)))) : null,
    );
  }
  const profiles = p.embryos.reduce((n, e) => n + e.profiles.length, 0);
  const channels = [...new Set(p.embryos.flatMap((e) => e.profiles.map((x) => x.channel)))];
  const columns = el(
    "table",
    { class: "data compact" },
    el("thead", {}, el("tr", {}, el("th", { scope: "col" }, "Column"), el("th", { scope: "col" }, "Read as"), el("th", { scope: "col" }, "Unit"))),
    el("tbody", {}, ...p.columns.map((c) => el("tr", {}, el("td", {}, c.header), el("td", {}, c.role), el("td", {}, c.unit ?? "—")))),
  );
  const embryos = el(
    "table",
    { class: "data compact" },
    el(
      "thead",
      {},
      el("tr", {}, ...["Embryo", "Genotype", "Length (µm)", "Channel", "Points", "Positions in", "Reversed"].map((h) => el("th", { scope: "col" }, h))),
    ),
    el(
      "tbody",
      {},
      ...p.embryos.flatMap((e) =>
        e.profiles.map((x) =>
          el(
            "tr",
            {},
            el("td", {}, e.label),
            el("td", {}, e.genotype ?? "— (none given)"),
            el("td", { class: "num" }, formatPlain(e.lengthUm)),
            el("td", {}, x.channel + (x.timeS !== null ? ` at ${x.timeS} s` : "")),
            el("td", { class: "num" }, x.points),
            el("td", {}, UNIT_NAMES[x.positionUnit] ?? x.positionUnit),
            el("td", {}, x.flipped ? "yes" : "no"),
          ),
        ),
      ),
    ),
  );
  const badge =
    p.status === "ok"
      ? el("span", { class: "badge badge-good" }, "ready to import")
      : p.status === "already-imported"
        ? el("span", { class: "badge badge-warn" }, "already imported")
        : el("span", { class: "badge badge-bad" }, `${p.database.conflicts} conflict${p.database.conflicts === 1 ? "" : "s"} with stored embryos — choose below`);
  return el(
    "article",
    { class: "preview-card", "data-file": p.file, "data-status": p.status },
    el("h3", {}, p.file, " ", badge),
    el("p", { class: "outcome", "data-role": "outcome" }, browserWording(p.outcome.message)),
    p.outcome.issues.length > 1 ? el("ul", { class: "issues" }, ...p.outcome.issues.slice(0, 50).map((i) => el("li", {}, browserWording(i.message)))) : null,
    storedEmbryos(p.database),
    facts([
      ["Table shape", p.format],
      ["Separator", SEPARATOR_NAMES[p.delimiter] ?? p.delimiter],
      ["Decimal mark", DECIMAL_NAMES[p.decimalMark] ?? p.decimalMark],
      ["Embryos", String(p.embryos.length)],
      ["Profiles", String(profiles)],
      ["Channels", channels.join(", ")],
    ]),
    warningList(p.warnings),
    p.droppedCells.length
      ? el(
          "details",
          {},
          el("summary", {}, `Dropped cells (${p.droppedCells.length}${p.droppedCells.length === 100 ? " or more" : ""})`),
          el("ul", {}, ...p.droppedCells.map((c) => el("li", {}, `row ${c.row}, column "${c.column}": "${c.value}"`))),
        )
      : null,
    el("details", {}, el("summary", {}, `Columns (${p.columns.length})`), el("div", { class: "table-scroll short" }, columns)),
    el("details", { open: p.embryos.length <= 12 }, el("summary", {}, `Embryos (${p.embryos.length})`), el("div", { class: "table-scroll short" }, embryos)),
  );
}

function showValue(v: string | number | null): string {
  return v === null ? "—" : typeof v === "number" ? formatPlain(v) : v;
}

function differences(list: FieldDifference[], arrow: boolean): string {
  return list.map((d) => (arrow ? `${d.name}: ${showValue(d.stored)} stored, ${showValue(d.file)} in the file` : `${d.name} ${showValue(d.file)}`)).join("; ");
}

/** Embryos of the file that the open data set already holds: what the file would add to each, and where it differs. */
function storedEmbryos(db: DatabaseComparison): HTMLElement | null {
  if (db.stored.length === 0) return null;
  const table = el(
    "table",
    { class: "data compact", "data-role": "stored-embryos" },
    el("thead", {}, el("tr", {}, ...["Embryo", "Stored from", "Would add", "Differs from stored"].map((h) => el("th", { scope: "col" }, h)))),
    el(
      "tbody",
      {},
      ...db.stored.map((s) =>
        el(
          "tr",
          { "data-embryo": s.label, class: s.conflicts.length || s.clashingProfiles.length ? "row-conflict" : "" },
          el("td", {}, s.label),
          el("td", {}, s.storedFrom),
          el(
            "td",
            {},
            [
              s.newProfiles.length ? `channel ${s.newProfiles.join(", ")}` : "",
              s.additions.length ? differences(s.additions, false) : "",
              s.unchangedProfiles.length ? `(${s.unchangedProfiles.join(", ")} already stored unchanged)` : "",
            ]
              .filter(Boolean)
              .join("; ") || "—",
          ),
          el("td", {}, [differences(s.conflicts, true), ...s.clashingProfiles.map((c) => `profile ${c.profile}: other values stored (from ${c.storedFrom})`)].filter(Boolean).join("; ") || "—"),
        ),
      ),
    ),
  );
  return el(
    "details",
    { open: true },
    el("summary", {}, `Already stored (${db.stored.length} of the file's embryos; ${db.newEmbryos.length} new)`),
    el("div", { class: "table-scroll short" }, table),
  );
}
