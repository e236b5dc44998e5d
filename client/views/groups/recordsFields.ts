import type { Choices } from "../../api/fetchChoices.ts";
import { el } from "../../components/el.ts";
import { checkboxGroup, field, numberInput, numberValue, select } from "../../components/formFields.ts";

/** Settings of where per-embryo values come from: shared by comparisons, tracking and planning. */
export interface RecordsSettings {
  genotypes: string[];
  channel: string;
  fitModel: string;
  threshold: number | undefined;
}

export const FIT_MODELS: [string, string][] = [
  ["exponential", "exponential"],
  ["finite", "finite"],
  ["source", "source"],
  ["power", "power"],
  ["power-free", "power-free"],
];

/**
 * Genotype checkboxes, channel, the fit model whose λ is used and an optional
 * boundary threshold; `read()` returns them as the API's request fields.
 */
export function recordsFields(choices: Choices, initial: RecordsSettings, legend = "Genotypes"): { element: HTMLElement; read(): RecordsSettings; body(): Record<string, unknown> } {
  const genotypes = checkboxGroup(legend, "genotypes", choices.genotypes.map((g) => [g, g]), initial.genotypes);
  const channel = select("channel", choices.channels.map((c): [string, string] => [c, c]), initial.channel || choices.channels[0]);
  const fitModel = select("fitModel", FIT_MODELS, initial.fitModel);
  const threshold = numberInput("threshold", initial.threshold ?? "", { placeholder: "a quarter of the way up" });
  const read = (): RecordsSettings => ({ genotypes: genotypes.values(), channel: channel.value, fitModel: fitModel.value, threshold: numberValue(threshold) });
  return {
    element: el(
      "div",
      {},
      genotypes.element,
      el("div", { class: "field-row" }, field("Channel", channel), field("λ from fits of the model", fitModel, "fitted now where missing"), field("Boundary threshold (a.u.)", threshold, "empty: a quarter of the way from the far-end to the source-end level")),
    ),
    read,
    body() {
      const r = read();
      return { selection: r.genotypes.length ? { genotypes: r.genotypes } : {}, channel: r.channel || undefined, fitModel: r.fitModel, ...(r.threshold !== undefined ? { threshold: r.threshold } : {}) };
    },
  };
}
