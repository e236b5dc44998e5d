import type { FitItem } from "../../api/types/fits.ts";
import { dataTable } from "../../components/dataTable.ts";
import { el } from "../../components/el.ts";
import { formatEstimate, formatEstimateInterval } from "../../format/formatEstimate.ts";
import { fixed, formatSignificant } from "../../format/significant.ts";

function windowText(w: FitItem["window"]): string {
  if (!w) return "whole profile";
  return `${w.xMinUm ?? "start"}–${w.xMaxUm ?? "end"}`;
}

/** λ ± SE and its 95% CI for every stored fit; a row opens that fit. */
export function fitTable(fits: FitItem[], csv: { href: string } | { fileName: string }, onOpen: (fit: FitItem, tr: HTMLTableRowElement) => void): HTMLElement {
  return dataTable<FitItem>({
    caption: "Decay length per embryo (newest fit per profile and model); select a row to see the profile",
    rows: fits,
    csv,
    groupBy: (f) => `${f.genotype} · ${f.channel}`,
    rowData: (f) => ({ fitId: String(f.fitId), embryo: f.embryo, model: f.model }),
    rowLabel: (f) => `${f.embryo}, ${f.model} fit: open the profile`,
    onActivate: onOpen,
    empty: "No fits for this selection yet: press Fit.",
    columns: [
      { header: "Embryo", cell: (f) => f.embryo },
      { header: "Channel", cell: (f) => f.channel + (f.timeS !== null ? ` at ${f.timeS} s` : "") },
      { header: "Model", cell: (f) => f.model },
      { header: "λ ± SE (µm)", cell: (f) => formatEstimate(f.lambdaUm), numeric: true },
      { header: "95% CI (µm)", cell: (f) => formatEstimateInterval(f.lambdaUm), numeric: true },
      { header: "Status", cell: (f) => el("span", { class: `status status-${f.status}`, title: f.message }, f.status) },
      { header: "Akaike weight", cell: (f) => formatSignificant(f.akaikeWeight, 2), numeric: true },
      { header: "AICc", cell: (f) => (f.aicc === null ? "—" : fixed(f.aicc, 1)), numeric: true },
      { header: "Window (µm)", cell: (f) => windowText(f.window) },
      { header: "Fit setting", cell: (f) => f.setting ?? "—" },
    ],
  });
}
