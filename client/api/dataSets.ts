import { apiGet, apiPost } from "./http.ts";
import type { DataSetsAnswer } from "./types/datasets.ts";

/** Sent on window after the open data set changed. */
export const DATA_SET_CHANGED = "morphogauge:data-set-changed";

export interface DataSetChange {
  answer: DataSetsAnswer;
  /** True when the view that asked for the switch redraws itself (an import waiting for it keeps its files). */
  keepView: boolean;
}

function announce(answer: DataSetsAnswer, keepView: boolean): DataSetsAnswer {
  window.dispatchEvent(new CustomEvent<DataSetChange>(DATA_SET_CHANGED, { detail: { answer, keepView } }));
  return answer;
}

export const getDataSets = () => apiGet<DataSetsAnswer>("api/datasets");
export const switchDataSet = async (id: string, keepView = false) => announce(await apiPost<DataSetsAnswer>("api/datasets/switch", { id }), keepView);
export const createDataSet = async (name: string, keepView = false) => announce(await apiPost<DataSetsAnswer>("api/datasets", { name }), keepView);
