import { el } from "../../components/el.ts";
import { keyNumbers } from "../../components/keyNumbers.ts";
import { warningNotice } from "../../components/notice.ts";
import { formatEstimate } from "../../format/formatEstimate.ts";
import { fixed, formatSignificant } from "../../format/significant.ts";
import { uncertaintyDecimals } from "../../format/uncertaintyDecimals.ts";
import type { GlobalFitView } from "./globalFitView.ts";


/**
 * A group's global fit (one λ shared by every embryo) beside the spread of
 * the per-embryo λ: when the spread is larger than noise allows, λ varies
 * between embryos and the per-embryo spread is the number to report.
 */
export function globalFitCard(g: GlobalFitView, ranking?: string): HTMLElement {
  const p = g.perEmbryo;
  // Mean, SD and median at the place the SEM allows, so they read as one set of numbers.
  const place = p ? uncertaintyDecimals(p.semUm) : null;
  const um = (x: number | undefined) => (x === undefined ? "—" : `${place === null ? formatSignificant(x, 3) : fixed(x, place)} µm`);
  return el(
    "article",
    { class: "global-fit", "data-genotype": g.genotype, "data-channel": g.channel, "data-model": g.model },
    el("h3", {}, `${g.genotype} · ${g.channel} — ${g.model} model`),
    keyNumbers([
      { label: "Global λ (shared by all embryos)", value: formatEstimate(g.lambdaUm, "µm", { ci: true }), key: "global-lambda" },
      { label: "Per-embryo λ: mean ± SD", value: p ? `${um(p.meanUm).replace(" µm", "")} ± ${um(p.sdUm)}` : "—", key: "per-embryo-spread" },
      { label: "Per-embryo λ: median", value: um(p?.medianUm) },
      { label: "Per-embryo λ: SEM", value: um(p?.semUm) },
      { label: "Embryos fitted / failed", value: p ? `${p.fitted} / ${p.failed}` : "—" },
      { label: "Mean per-embryo λ ÷ global λ", value: p ? formatSignificant(p.meanOverGlobal, 3) : "—" },
    ]),
    el("p", { class: "muted" }, `${g.status}: ${g.message}`),
    g.note ? el("p", {}, g.note) : null,
    g.window ? el("p", { class: "muted", "data-role": "global-window" }, `Window: ${g.window}.`) : null,
    g.preference ? (g.preference.agrees ? el("p", { class: "muted" }, `${g.preference.message}.`) : warningNotice(g.preference.message)) : null,
    ranking ? el("p", {}, `Model ranking for the group: ${ranking}`) : null,
  );
}
