import { el, replaceChildren } from "../components/el.ts";
import { embryoList } from "./data/embryoList.ts";
import { importList } from "./data/importList.ts";
import { importPanel } from "./data/importPanel.ts";

/** Data: add profile files (with a preview before anything is stored), browse the stored embryos, delete imports. */
export function renderDataView(root: HTMLElement): void {
  const embryos = embryoList();
  const imports = importList(() => {
    void embryos.refresh();
    void imports.refresh();
  });
  const add = importPanel(() => {
    void embryos.refresh();
    void imports.refresh();
  });
  replaceChildren(root, el("h1", { class: "visually-hidden" }, "Data"), add, embryos.element, imports.element);
  void embryos.refresh();
  void imports.refresh();
}
