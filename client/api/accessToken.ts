import { el } from "../components/el.ts";
import { button } from "../components/formFields.ts";

const STORAGE_KEY = "morphogauge-token";
/** Same name as the server's TOKEN_COOKIE: links and progress streams (GET only) carry the token in it. */
const COOKIE = "morphogauge_token";

let pending: Promise<string | null> | null = null;

/** The access token this page was given, if any. */
export function savedToken(): string | null {
  try {
    return localStorage.getItem(STORAGE_KEY);
  } catch {
    return null;
  }
}

function save(token: string): void {
  try {
    localStorage.setItem(STORAGE_KEY, token);
  } catch {
    // Storage may be off (private window): the token then lasts for this page only.
  }
  document.cookie = `${COOKIE}=${encodeURIComponent(token)}; path=/; SameSite=Strict`;
}

/** Headers every API request carries: the token when there is one, and the header a cross-site form cannot send. */
export function authHeaders(): Record<string, string> {
  const token = savedToken();
  return { "x-requested-with": "morphogauge", ...(token ? { authorization: `Bearer ${token}` } : {}) };
}

/**
 * Ask once for the server's access token (a server shared with colleagues
 * needs one); resolves with it, or null when the user closes the dialog.
 * Concurrent requests that all got 401 share one dialog.
 */
export function askForToken(wrong: boolean): Promise<string | null> {
  pending ??= new Promise<string | null>((resolve) => {
    const dialog = el("dialog", { class: "confirm", "aria-labelledby": "token-title", "data-role": "token-dialog" });
    const input = el("input", { type: "password", autocomplete: "off", "aria-label": "Access token", "data-role": "token-input" });
    const finish = (token: string | null) => {
      dialog.close();
      dialog.remove();
      pending = null;
      if (token) save(token);
      resolve(token);
    };
    const form = el(
      "form",
      { method: "dialog" },
      el("h2", { id: "token-title" }, "Access token"),
      el("p", {}, wrong ? "That token was not accepted. Ask the person who started the server for its access token." : "This morphogauge server is shared and needs its access token. The person who started it has it (it was printed when the server started)."),
      input,
      el("div", { class: "actions" }, button("Cancel", () => finish(null), "secondary"), el("button", { type: "submit", class: "btn btn-primary", "data-role": "token-submit" }, "Use this token")),
    );
    form.addEventListener("submit", (e) => {
      e.preventDefault();
      finish(input.value.trim() || null);
    });
    dialog.addEventListener("cancel", (e) => {
      e.preventDefault();
      finish(null);
    });
    dialog.append(form);
    document.body.append(dialog);
    dialog.showModal();
    input.focus();
  });
  return pending;
}
