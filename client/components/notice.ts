import { plainMessage } from "../api/apiError.ts";
import { el } from "./el.ts";

/** An error told in plain words, read out by screen readers as it appears. */
export function errorNotice(error: unknown): HTMLElement {
  const { message, details } = plainMessage(error);
  return el(
    "div",
    { class: "notice notice-error", role: "alert" },
    el("p", {}, message),
    details.length ? el("ul", {}, ...details.map((d) => el("li", {}, d))) : null,
  );
}

/** A calm note: a caveat, a method statement, a reminder. */
export function infoNotice(...children: (Node | string)[]): HTMLElement {
  return el("div", { class: "notice notice-info" }, ...children);
}

/** A warning the user should look at, with how to fix it when known. */
export function warningNotice(message: string, hint?: string | null): HTMLElement {
  return el("div", { class: "notice notice-warning" }, el("p", {}, message), hint ? el("p", { class: "hint" }, hint) : null);
}
