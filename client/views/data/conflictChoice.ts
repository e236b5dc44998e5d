import { el } from "../../components/el.ts";
import { fieldId } from "../../components/formFields.ts";

export type ConflictChoiceValue = "refuse" | "keep" | "replace" | "rename";

/**
 * What to do when a file gives other values than the stored embryos of the
 * same label (a length, a genotype, a stage): import nothing and show the
 * conflicts, keep the stored values, take the file's (undone when the import
 * is deleted), or import the file's embryos as new ones under a label prefix.
 */
export function conflictChoice(onChange: () => void): { element: HTMLElement; fields(): Record<string, string>; chosen(): ConflictChoiceValue; show(visible: boolean): void } {
  const options: [ConflictChoiceValue, string][] = [
    ["refuse", "Import nothing while values differ (show me the conflicts)"],
    ["keep", "Keep the stored values (the file's are listed with the import, not applied)"],
    ["replace", "Take the file's values (recorded with the import; deleting it puts the stored ones back)"],
    ["rename", "Import the file's embryos as new ones, with this label prefix:"],
  ];
  const prefix = el("input", { type: "text", name: "conflictPrefix", placeholder: "e.g. run2-", "aria-label": "Label prefix for the file's embryos" });
  const radios = options.map(([value, text]) => {
    const id = fieldId("conflict");
    const radio = el("input", { type: "radio", name: "onConflict", value, id });
    radio.checked = value === "refuse";
    return { radio, label: el("label", { for: id }, radio, " ", text, value === "rename" ? prefix : null) };
  });
  const element = el(
    "fieldset",
    { class: "conflict-choice", "data-role": "conflict-choice", hidden: true },
    el("legend", {}, "Embryos already stored with other values"),
    ...radios.map((r) => r.label),
  );
  element.addEventListener("change", onChange);
  const chosen = () => (radios.find((r) => r.radio.checked)?.radio.value ?? "refuse") as ConflictChoiceValue;
  return {
    element,
    chosen,
    fields(): Record<string, string> {
      const c = chosen();
      if (c === "rename") return prefix.value.trim() ? { labelPrefix: prefix.value.trim() } : {};
      return { onConflict: c };
    },
    show(visible) {
      element.hidden = !visible;
    },
  };
}
