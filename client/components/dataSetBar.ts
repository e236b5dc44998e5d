import { createDataSet, DATA_SET_CHANGED, getDataSets, switchDataSet, type DataSetChange } from "../api/dataSets.ts";
import type { DataSetsAnswer, DataSetView } from "../api/types/datasets.ts";
import { el, replaceChildren } from "./el.ts";
import { button, select, textInput } from "./formFields.ts";
import { errorNotice } from "./notice.ts";

/** How a data set is named on the page. */
export function dataSetName(d: DataSetView): string {
  if (d.kind === "demo") return "demo data (invented)";
  return d.exists ? d.id : `${d.id} (new)`;
}

/**
 * The top bar's data set: which database is open, marked "demo data
 * (invented)" while the demo is, with a switch to the others and a way to
 * create a new one. Shown on every view.
 */
export function dataSetBar(): { element: HTMLElement; refresh(): Promise<void> } {
  const element = el("div", { class: "dataset-bar", "data-role": "dataset-bar" });
  const draw = (answer: DataSetsAnswer) => {
    const c = answer.current;
    const marker =
      c.kind === "demo"
        ? el("span", { class: "badge badge-demo", "data-role": "dataset-marker", "data-kind": "demo", title: "Invented data for trying morphogauge out; your own files go into your own data set." }, "demo data (invented)")
        : el("span", { class: "badge badge-good", "data-role": "dataset-marker", "data-kind": "user", title: c.path }, `your data: ${c.id}`);
    if (!answer.switchable) {
      replaceChildren(element, marker);
      return;
    }
    const choice = select("dataset", answer.available.map((d) => [d.id, dataSetName(d)]), c.id);
    choice.setAttribute("aria-label", "Data set");
    choice.addEventListener("change", () => void switchDataSet(choice.value).catch(showError));
    const name = textInput("newDataSet", "", "name of a new data set");
    name.setAttribute("aria-label", "Name of a new data set");
    const create = button("New data set", () => void createDataSet(name.value.trim()).catch(showError), "secondary", { "data-role": "create-dataset" });
    const newForm = el("details", { class: "dataset-new" }, el("summary", {}, "New…"), name, create);
    replaceChildren(element, marker, choice, newForm);
  };
  const showError = (e: unknown) => {
    element.append(errorNotice(e));
  };
  const refresh = async () => {
    try {
      draw(await getDataSets());
    } catch (e) {
      replaceChildren(element, errorNotice(e));
    }
  };
  window.addEventListener(DATA_SET_CHANGED, (e) => draw((e as CustomEvent<DataSetChange>).detail.answer));
  return { element, refresh };
}
