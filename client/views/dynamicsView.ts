import { fetchChoices } from "../api/fetchChoices.ts";
import { el, replaceChildren } from "../components/el.ts";
import { errorNotice } from "../components/notice.ts";
import { buildUpSection } from "./dynamics/buildUpSection.ts";
import { combineSection } from "./dynamics/combineSection.ts";
import { frapSection } from "./dynamics/frapSection.ts";
import { whatIfSection } from "./dynamics/whatIfSection.ts";

/** Dynamics: D and k separately, from the build-up over time and from FRAP, their combination with λ, and a what-if simulator. */
export function renderDynamicsView(root: HTMLElement): void {
  const body = el("div");
  replaceChildren(root, el("h1", { class: "visually-hidden" }, "Dynamics"), body);
  fetchChoices()
    .then((choices) => {
      const combine = combineSection(choices);
      replaceChildren(body, buildUpSection(choices), frapSection((id) => combine.setFrap(id)), combine.element, whatIfSection());
    })
    .catch((e) => replaceChildren(body, errorNotice(e)));
}
