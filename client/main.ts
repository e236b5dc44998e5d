import { DATA_SET_CHANGED, type DataSetChange } from "./api/dataSets.ts";
import { destroyCharts } from "./components/chartPanel.ts";
import { dataSetBar } from "./components/dataSetBar.ts";
import { el } from "./components/el.ts";
import { VIEWS, viewFromHash, type ViewId } from "./router.ts";
import { renderDataView } from "./views/dataView.ts";
import { renderFitsView } from "./views/fitsView.ts";
import { renderGroupsView } from "./views/groupsView.ts";
import { renderPrecisionView } from "./views/precisionView.ts";

const RENDER: Record<ViewId, (root: HTMLElement) => void> = {
  data: renderDataView,
  fits: renderFitsView,
  precision: renderPrecisionView,
  groups: renderGroupsView,
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

const dataSet = dataSetBar();
document.getElementById("dataset")!.replaceChildren(dataSet.element);
void dataSet.refresh();

window.addEventListener("hashchange", show);
// Another data set is open: every view redraws from it, except an import waiting for the switch (it asked for it).
window.addEventListener(DATA_SET_CHANGED, (e) => {
  if (!(e as CustomEvent<DataSetChange>).detail.keepView) show();
});
show();
