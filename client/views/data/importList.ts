import { apiDelete, apiGet } from "../../api/http.ts";
import type { StoredImport } from "../../api/types/imports.ts";
import { confirmDialog } from "../../components/confirmDialog.ts";
import { dataTable } from "../../components/dataTable.ts";
import { el, replaceChildren } from "../../components/el.ts";
import { button } from "../../components/formFields.ts";
import { errorNotice, infoNotice } from "../../components/notice.ts";
import { formatSignificant } from "../../format/significant.ts";

/** Imported files, each with a Delete button that removes only what that import added. */
export function importList(onDeleted: () => void): { element: HTMLElement; refresh(): Promise<void> } {
  const body = el("div", { "data-role": "import-list" });
  const status = el("div", { "aria-live": "polite" });

  const remove = async (imp: StoredImport) => {
    const ok = await confirmDialog(
      `Delete import #${imp.id}?`,
      `This removes the ${imp.profiles} profiles that "${imp.fileName}" added, their fits, and embryos left with no profile` +
        (imp.valuesChanged ? `, and puts back the ${imp.valuesChanged} values it changed on embryos stored before it` : "") +
        ". Other imports are not touched. This cannot be undone.",
      "Delete import",
    );
    if (!ok) return;
    try {
      const answer = await apiDelete<{ deleted: { profiles: number; embryos: number; valuesRestored: number } }>(`api/imports/${imp.id}`);
      const restored = answer.deleted.valuesRestored ? `; ${answer.deleted.valuesRestored} values of other embryos put back` : "";
      replaceChildren(status, infoNotice(`Deleted import #${imp.id} ("${imp.fileName}"): ${answer.deleted.profiles} profiles and ${answer.deleted.embryos} embryos removed${restored}.`));
      onDeleted();
    } catch (e) {
      replaceChildren(status, errorNotice(e));
    }
  };

  const refresh = async () => {
    try {
      const { imports } = await apiGet<{ imports: StoredImport[] }>("api/imports");
      replaceChildren(
        body,
        dataTable<StoredImport>({
          caption: "Imported files",
          rows: imports,
          csv: { fileName: "imports.csv" },
          empty: "Nothing imported yet.",
          rowData: (i) => ({ importId: String(i.id) }),
          columns: [
            { header: "#", cell: (i) => i.id, numeric: true },
            { header: "File", cell: (i) => i.fileName + (i.metaFileName ? ` (+ ${i.metaFileName})` : "") },
            { header: "Shape", cell: (i) => i.format },
            { header: "Size (KiB)", cell: (i) => formatSignificant(i.byteSize / 1024, 3), numeric: true },
            { header: "Imported (UTC)", cell: (i) => i.importedAt.replace("T", " ").slice(0, 16) },
            { header: "Embryos", cell: (i) => i.embryos, numeric: true },
            { header: "Profiles", cell: (i) => i.profiles, numeric: true },
            { header: "Values changed", cell: (i) => i.valuesChanged, numeric: true },
            { header: "Warnings", cell: (i) => (i.warnings.length ? el("span", { title: i.warnings.map((w) => w.message).join("\n") }, String(i.warnings.length)) : "0"), numeric: true },
            { header: "", cell: (i) => button("Delete", () => void remove(i), "danger", { "aria-label": `Delete import #${i.id} (${i.fileName})`, "data-role": "delete-import" }), csv: () => null },
          ],
        }),
      );
    } catch (e) {
      replaceChildren(body, errorNotice(e));
    }
  };

  const element = el("section", { class: "panel", "aria-labelledby": "imports-title" }, el("h2", { id: "imports-title" }, "Imports"), status, body);
  return { element, refresh };
}
