import { el } from "./el.ts";

/** Headline numbers as labelled tiles; `key` names each tile for tests and styling. */
export function keyNumbers(items: { label: string; value: string; note?: string; key?: string }[]): HTMLElement {
  return el(
    "dl",
    { class: "key-numbers" },
    ...items.map((i) => el("div", { "data-key": i.key ?? null }, el("dt", {}, i.label), el("dd", {}, i.value, i.note ? el("small", {}, ` ${i.note}`) : null))),
  );
}
