import { el } from "./el.ts";
import { fieldId } from "./formFields.ts";

/**
 * An area that takes files by drag and drop or from a file picker (a real,
 * keyboard-reachable <input type="file">). Calls `onFiles` with every batch;
 * `title` says what belongs there.
 */
export function dropZone(onFiles: (files: File[]) => void, title = "Drop profile exports here (CSV or TSV), with an optional metadata side file"): HTMLElement {
  const id = fieldId("files");
  const input = el("input", { type: "file", id, multiple: true, accept: ".csv,.tsv,.txt,text/csv,text/tab-separated-values,text/plain", "data-role": "file-input" });
  input.addEventListener("change", () => {
    if (input.files && input.files.length) onFiles([...input.files]);
    input.value = "";
  });
  const zone = el(
    "div",
    { class: "drop-zone", "data-role": "drop-zone" },
    el("p", { class: "drop-title" }, title),
    el("label", { for: id, class: "btn btn-secondary" }, "Choose files…"),
    input,
  );
  zone.addEventListener("dragover", (e) => {
    e.preventDefault();
    zone.classList.add("dragging");
  });
  zone.addEventListener("dragleave", () => zone.classList.remove("dragging"));
  zone.addEventListener("drop", (e) => {
    e.preventDefault();
    zone.classList.remove("dragging");
    const files = [...(e.dataTransfer?.files ?? [])];
    if (files.length) onFiles(files);
  });
  return zone;
}
