import { createDataSet, getDataSets, switchDataSet } from "../../api/dataSets.ts";
import { apiUpload } from "../../api/http.ts";
import type { ImportAnswer, ImportReport, PreviewAnswer } from "../../api/types/imports.ts";
import { dropZone } from "../../components/dropZone.ts";
import { el, replaceChildren } from "../../components/el.ts";
import { button, select } from "../../components/formFields.ts";
import { errorNotice, infoNotice } from "../../components/notice.ts";
import { browserWording } from "../../format/browserWording.ts";
import { formatSignificant } from "../../format/significant.ts";
import { conflictChoice } from "./conflictChoice.ts";
import { guessFileRole, type FileRole } from "./fileRole.ts";
import { importOptionsForm } from "./importOptionsForm.ts";
import { previewCard, warningList } from "./previewCard.ts";

interface Pending {
  file: File;
  role: FileRole;
}

/**
 * Add files: drop or pick them, set the import options, see what the importer
 * reads and how it compares with the open data set (nothing stored yet), choose
 * what to do with values that differ from stored embryos, then confirm. Files
 * never go into the demo: while it is open, the panel asks which data set of
 * your own to use. Calls `onImported` after an import that stored something,
 * and after switching data sets.
 */
export function importPanel(onImported: () => void): HTMLElement {
  let pending: Pending[] = [];
  let previewed = false;
  let request = 0;

  const fileList = el("ul", { class: "file-list", "data-role": "file-list" });
  const previewArea = el("div", { class: "preview", "data-role": "preview", "aria-live": "polite" });
  const resultArea = el("div", { class: "import-result", "data-role": "import-result", "aria-live": "polite" });
  const options = importOptionsForm(() => void preview());
  const choice = conflictChoice(() => void preview());
  const confirm = button("Import", () => void runImport(), "primary", { "data-role": "confirm-import" });
  const clear = button("Clear", () => {
    pending = [];
    showFiles();
    replaceChildren(previewArea);
    void preview();
  });
  confirm.disabled = true;

  const form = (): FormData => {
    const f = new FormData();
    for (const p of pending.filter((x) => x.role === "profiles")) f.append("files", p.file, p.file.name);
    const meta = pending.find((x) => x.role === "meta");
    if (meta) f.append("meta", meta.file, meta.file.name);
    for (const [k, v] of Object.entries({ ...options.fields(), ...choice.fields() })) f.append(k, v);
    return f;
  };

  const showFiles = () => {
    replaceChildren(
      fileList,
      ...pending.map((p, i) => {
        const role = select("role", [
          ["profiles", "profiles"],
          ["meta", "metadata side file"],
        ], p.role);
        role.setAttribute("aria-label", `Role of ${p.file.name}`);
        role.addEventListener("change", () => {
          // Only one side file: choosing another turns the previous one back into profiles.
          for (const q of pending) if (q !== p && role.value === "meta" && q.role === "meta") q.role = "profiles";
          p.role = role.value as FileRole;
          showFiles();
          void preview();
        });
        const remove = button("Remove", () => {
          pending.splice(i, 1);
          showFiles();
          void preview();
        }, "secondary", { "aria-label": `Remove ${p.file.name}` });
        return el("li", {}, el("span", { class: "file-name" }, p.file.name), el("span", { class: "file-size" }, `${formatSignificant(p.file.size / 1024, 3)} KiB`), role, remove);
      }),
    );
  };

  const preview = async () => {
    const mine = ++request;
    previewed = false;
    confirm.disabled = true;
    replaceChildren(resultArea);
    if (!pending.some((p) => p.role === "profiles")) {
      replaceChildren(previewArea, pending.length ? infoNotice("Add at least one profile file; a side file alone holds no profiles.") : null);
      return;
    }
    replaceChildren(previewArea, el("p", { class: "muted" }, "Reading the files…"));
    try {
      const sets = await getDataSets();
      if (mine !== request) return;
      if (sets.current.kind === "demo") {
        replaceChildren(previewArea, chooseOwnDataSet(sets.available.filter((d) => d.kind === "user")));
        return;
      }
      const answer = await apiUpload<PreviewAnswer>("api/imports/preview", form());
      if (mine !== request) return;
      const ok = answer.files.filter((f) => f.status === "ok").length;
      choice.show(answer.files.some((f) => f.status === "conflicts") || choice.chosen() !== "refuse");
      replaceChildren(
        previewArea,
        el("h3", { class: "section-note" }, `Preview against ${sets.current.id} — nothing is stored until you press Import`),
        ...(answer.notes ?? []).map((n) => infoNotice(n)),
        ...answer.files.map(previewCard),
      );
      previewed = ok > 0;
      confirm.disabled = !previewed;
      confirm.textContent = ok === 0 ? "Import" : ok === 1 ? "Import 1 file" : `Import ${ok} files`;
    } catch (e) {
      if (mine === request) replaceChildren(previewArea, errorNotice(e));
    }
  };

  const runImport = async () => {
    if (!previewed) return;
    confirm.disabled = true;
    replaceChildren(resultArea, el("p", { class: "muted" }, "Importing…"));
    try {
      const answer = await apiUpload<ImportAnswer>("api/imports", form(), { acceptStatus: [422] });
      replaceChildren(resultArea, el("h3", {}, "Import result"), ...answer.files.map(reportLine));
      if (answer.files.some((f) => f.status === "imported")) {
        pending = [];
        previewed = false;
        showFiles();
        replaceChildren(previewArea);
        onImported();
      } else confirm.disabled = false;
    } catch (e) {
      replaceChildren(resultArea, errorNotice(e));
      confirm.disabled = false;
    }
  };

  /** While the demo is open: the lab's data sets to import into, or a new one. */
  const chooseOwnDataSet = (own: { id: string; exists: boolean }[]): HTMLElement => {
    const after = async (switching: Promise<unknown>) => {
      try {
        await switching;
        onImported();
        await preview();
      } catch (e) {
        replaceChildren(previewArea, errorNotice(e));
      }
    };
    const name = el("input", { type: "text", name: "dataSetName", placeholder: "e.g. spring-imaging", "aria-label": "Name of the new data set" });
    return el(
      "div",
      { class: "notice notice-warning", "data-role": "demo-import-guard" },
      el("p", {}, "The demo data set (invented) is open. Your files go into a data set of your own, never into the demo, so that your embryos and the demo's never share a group."),
      el(
        "div",
        { class: "actions" },
        ...own.map((d) => button(`Import into ${d.id}${d.exists ? "" : " (new file)"}`, () => void after(switchDataSet(d.id, true)), "primary", { "data-role": "use-own-dataset", "data-dataset": d.id })),
        name,
        button("Create a new data set", () => void after(createDataSet(name.value.trim(), true)), "secondary", { "data-role": "create-own-dataset" }),
      ),
    );
  };

  const zone = dropZone((files) => {
    for (const file of files) {
      const role = guessFileRole(file.name);
      if (role === "meta") for (const q of pending) if (q.role === "meta") q.role = "profiles";
      pending.push({ file, role });
    }
    showFiles();
    void preview();
  });

  return el(
    "section",
    { class: "panel", "aria-labelledby": "add-title" },
    el("h2", { id: "add-title" }, "Add profiles"),
    zone,
    fileList,
    options.element,
    previewArea,
    choice.element,
    el("div", { class: "actions" }, confirm, clear),
    resultArea,
  );
}

function reportLine(r: ImportReport): HTMLElement {
  if (r.status === "rejected") {
    return el("div", { class: "report report-bad", "data-status": "rejected" }, el("strong", {}, r.file), ": rejected, nothing stored. ", browserWording(r.error.message));
  }
  return el(
    "div",
    { class: "report report-good", "data-status": r.status },
    el("strong", {}, r.file),
    `: ${browserWording(r.message)}${r.status === "imported" ? ` (import #${r.importId})` : ""}.`,
    warningList(r.warnings),
  );
}
