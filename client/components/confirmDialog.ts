import { el } from "./el.ts";
import { button } from "./formFields.ts";

/**
 * Ask before something that cannot be undone. A modal <dialog>: focus moves
 * into it, Escape answers "no", and the safe choice has the focus first.
 */
export function confirmDialog(title: string, message: string, confirmText: string): Promise<boolean> {
  return new Promise((resolve) => {
    const dialog = el("dialog", { class: "confirm", "aria-labelledby": "confirm-title" });
    const finish = (answer: boolean) => {
      dialog.close();
      dialog.remove();
      resolve(answer);
    };
    const keep = button("Cancel", () => finish(false), "secondary");
    const go = button(confirmText, () => finish(true), "danger");
    dialog.append(el("h2", { id: "confirm-title" }, title), el("p", {}, message), el("div", { class: "actions" }, keep, go));
    dialog.addEventListener("cancel", (e) => {
      e.preventDefault();
      finish(false);
    });
    document.body.append(dialog);
    dialog.showModal();
    keep.focus();
  });
}
