import { apiPost } from "../api/http.ts";
import type { LeftOut } from "../api/types/inputs.ts";
import { append, el } from "./el.ts";
import { button, field, textInput } from "./formFields.ts";
import { errorNotice } from "./notice.ts";

/** Which embryo, or which channel's profile of it. */
export interface ExclusionTarget {
  embryo: string;
  channel?: string;
}

const targetText = (t: ExclusionTarget) => `${t.embryo}${t.channel ? `, channel ${t.channel}` : ""}`;

/**
 * Ask for the reason and exclude the embryo (or profile): a modal dialog whose
 * safe choice has the focus first. Resolves true when the exclusion was stored.
 */
export function excludeDialog(target: ExclusionTarget, suggestion = "", offerChannel?: string): Promise<boolean> {
  return new Promise((resolve) => {
    const dialog = el("dialog", { class: "confirm", "aria-labelledby": "exclude-title", "data-role": "exclude-dialog" });
    const reason = textInput("reason", suggestion, "e.g. out of focus");
    const onlyChannel = offerChannel ? el("input", { type: "checkbox", name: "onlyChannel" }) : null;
    const problem = el("div");
    const finish = (answer: boolean) => {
      dialog.close();
      dialog.remove();
      resolve(answer);
    };
    const cancel = button("Cancel", () => finish(false), "secondary");
    const go = button(
      "Exclude",
      () => {
        void apiPost("api/exclusions", { ...target, ...(onlyChannel?.checked ? { channel: offerChannel } : {}), reason: reason.value })
          .then(() => finish(true))
          .catch((e) => problem.replaceChildren(errorNotice(e)));
      },
      "danger",
      { "data-role": "confirm-exclude" },
    );
    append(
      dialog,
      el("h2", { id: "exclude-title" }, `Exclude ${targetText(target)}`),
      el("p", {}, "The embryo stays stored. Group analyses and precision leave it out from now on and list it with this reason; you can include it again at any time."),
      field("Reason", reason),
      onlyChannel ? el("label", { class: "check" }, onlyChannel, ` only the ${offerChannel} profile (keep the embryo's other channels)`) : null,
      problem,
      el("div", { class: "actions" }, cancel, go),
    );
    dialog.addEventListener("cancel", (e) => {
      e.preventDefault();
      finish(false);
    });
    document.body.append(dialog);
    dialog.showModal();
    reason.focus();
  });
}

/** A small "Exclude…" button that asks for the reason, then calls `done`. */
export function excludeButton(target: ExclusionTarget, done: () => void, suggestion = "", offerChannel?: string): HTMLButtonElement {
  return button("Exclude…", () => void excludeDialog(target, suggestion, offerChannel).then((ok) => ok && done()), "secondary", { "data-role": "exclude", "data-embryo": target.embryo });
}

/** An "Include again" button for something excluded. */
export function includeButton(target: ExclusionTarget, done: () => void, onError: (e: unknown) => void): HTMLButtonElement {
  return button("Include again", () => void apiPost("api/inclusions", target).then(done).catch(onError), "secondary", { "data-role": "include", "data-embryo": target.embryo });
}

/** "wt-03 (out of focus)" or "wt-03, channel glm (bleached)". */
export function leftOutText(l: LeftOut): string {
  return `${l.embryo}${l.scope === "profile" ? `, channel ${l.channel}${l.time_s !== null ? ` at ${l.time_s} s` : ""}` : ""} (${l.reason})`;
}
