import { destroyCharts } from "./components/chartPanel.ts";
import { el } from "./components/el.ts";
import { VIEWS, viewFromHash, type ViewId } from "./router.ts";
import { renderDataView } from "./views/dataView.ts";
import { renderFitsView } from "./views/fitsView.ts";
import { renderGroupsView } from "./views/groupsView.ts";
import { renderPrecisionView } from "./views/precisionView.ts";
import { renderDynamicsView } from "./views/dynamicsView.ts";

const RENDER: Record<ViewId, (root: HTMLElement) => void> = {
  data: renderDataView,
  fits: renderFitsView,
  precision: renderPrecisionView,
  groups: renderGroupsView,
  dynamics: renderDynamicsView,
};

const app = document.getElementById("app")!;
const nav = document.getElementById("views")!;
const links = VIEWS.map((v) => el("a", { href: `#/${v.id}`, "data-view": v.id }, v.title));
nav.replaceChildren(...links);

function show(): void {
  const id = viewFromHash(location.hash);
  for (const a of links) {
    if (a.dataset.view === id) a.setAttribute("aria-current", "page");
    else a.removeAttribute("aria-current");
  }
  destroyCharts(app);
  app.dataset.view = id;
  document.title = `${VIEWS.find((v) => v.id === id)!.title} · morphogauge`;
  RENDER[id](app);
}

window.addEventListener("hashchange", show);
show();
