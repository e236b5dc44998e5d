import { fetchChoices } from "../api/fetchChoices.ts";
import { el, replaceChildren } from "../components/el.ts";
import { errorNotice } from "../components/notice.ts";
import { compareSection } from "./groups/compareSection.ts";
import { planSection } from "./groups/planSection.ts";
import { trackSection } from "./groups/trackSection.ts";

/** Groups: compare genotypes (or stages, dosages, sessions), follow trends, and plan sample sizes. */
export function renderGroupsView(root: HTMLElement): void {
  replaceChildren(root, el("h1", { class: "visually-hidden" }, "Groups"), el("p", { class: "muted" }, "Loading…"));
  fetchChoices()
    .then((choices) => replaceChildren(root, el("h1", { class: "visually-hidden" }, "Groups"), compareSection(choices), trackSection(choices), planSection(choices)))
    .catch((e) => replaceChildren(root, errorNotice(e)));
}
