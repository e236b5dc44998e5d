import { el } from "./el.ts";

let counter = 0;
/** A unique id for label/for pairs. */
export function fieldId(prefix: string): string {
  counter += 1;
  return `${prefix}-${counter}`;
}

/** A labelled form control wrapped in a field block. */
export function field(label: string, control: HTMLElement, hint?: string): HTMLElement {
  const id = control.id || fieldId("f");
  control.id = id;
  return el("div", { class: "field" }, el("label", { for: id }, label), control, hint ? el("small", { class: "hint" }, hint) : null);
}

/** A select with (value, text) options; the first option is chosen unless `value` is given. */
export function select(name: string, options: [string, string][], value?: string): HTMLSelectElement {
  const s = el("select", { name });
  for (const [v, text] of options) s.append(el("option", { value: v }, text));
  if (value !== undefined) s.value = value;
  return s;
}

export function numberInput(name: string, value: number | "" = "", attrs: { min?: number; max?: number; step?: number | "any"; placeholder?: string } = {}): HTMLInputElement {
  return el("input", { type: "number", name, value: String(value), min: attrs.min, max: attrs.max, step: attrs.step ?? "any", placeholder: attrs.placeholder, inputmode: "decimal" });
}

export function textInput(name: string, value = "", placeholder = ""): HTMLInputElement {
  return el("input", { type: "text", name, value, placeholder, autocomplete: "off" });
}

/** The number typed in an input, or undefined when it is empty or not a number. */
export function numberValue(input: HTMLInputElement): number | undefined {
  if (input.value.trim() === "") return undefined;
  const n = Number(input.value);
  return Number.isFinite(n) ? n : undefined;
}

/** A group of checkboxes in a fieldset; returns the fieldset and a reader of the checked values. */
export function checkboxGroup(legend: string, name: string, options: [string, string][], checked: string[]): { element: HTMLFieldSetElement; values(): string[] } {
  const boxes = options.map(([v, text]) => {
    const id = fieldId(name);
    const box = el("input", { type: "checkbox", id, name, value: v });
    box.checked = checked.includes(v);
    return { box, label: el("label", { for: id, class: "check" }, box, " ", text) };
  });
  const element = el("fieldset", { class: "checks" }, el("legend", {}, legend), ...boxes.map((b) => b.label));
  return { element, values: () => boxes.filter((b) => b.box.checked).map((b) => b.box.value) };
}

/** A button; `kind` picks the style (primary for the main action of a form). */
export function button(text: string, onClick: (e: MouseEvent) => void, kind: "primary" | "secondary" | "danger" = "secondary", attrs: Record<string, string> = {}): HTMLButtonElement {
  const b = el("button", { type: "button", class: `btn btn-${kind}`, ...attrs }, text);
  b.addEventListener("click", onClick);
  return b;
}
