import type { Choices } from "../../api/fetchChoices.ts";
import { apiGet } from "../../api/http.ts";
import type { FitSettingsOverview } from "../../api/types/inputs.ts";
import { el } from "../../components/el.ts";
import { checkboxGroup, field, numberInput, numberValue, select } from "../../components/formFields.ts";

/** Settings of where per-embryo values come from: shared by comparisons, tracking and planning. */
export interface RecordsSettings {
  genotypes: string[];
  channel: string;
  /** Named fit setting; "" for the one covering every selected profile. */
  fits: string;
  /** "" for any model, a model name, or "best". */
  fitModel: string;
  includeExcluded: boolean;
  threshold: number | undefined;
}

export const FIT_MODELS: [string, string][] = [
  ["", "any (as the fit setting says)"],
  ["best", "best by summed AICc, one for all groups"],
  ["exponential", "exponential"],
  ["finite", "finite"],
  ["source", "source"],
  ["power", "power"],
  ["power-free", "power-free"],
];

/**
 * Genotype checkboxes, channel, the fit setting and model whose λ is used,
 * whether excluded embryos count, and an optional boundary threshold;
 * `read()` returns them as the API's request fields.
 */
export function recordsFields(choices: Choices, initial: RecordsSettings, legend = "Genotypes"): { element: HTMLElement; read(): RecordsSettings; body(): Record<string, unknown> } {
  const genotypes = checkboxGroup(legend, "genotypes", choices.genotypes.map((g) => [g, g]), initial.genotypes);
  const channel = select("channel", choices.channels.map((c): [string, string] => [c, c]), initial.channel || choices.channels[0]);
  const fitModel = select("fitModel", FIT_MODELS, initial.fitModel);
  const fits = select("fits", [["", "the one covering every selected profile"]]);
  const loadSettings = () =>
    apiGet<FitSettingsOverview>("api/fit-settings", { channel: channel.value })
      .then((o) => {
        fits.replaceChildren(
          el("option", { value: "" }, "the one covering every selected profile"),
          ...o.settings.map((st) => el("option", { value: st.name }, `${st.name} — ${st.description} (${st.coverage.map((c) => `${c.genotype} ${c.fitted}/${c.profiles}`).join(", ")})`)),
        );
        fits.value = o.settings.some((st) => st.name === initial.fits) ? initial.fits : "";
      })
      .catch(() => undefined);
  void loadSettings();
  channel.addEventListener("change", () => void loadSettings());
  const includeExcluded = el("input", { type: "checkbox", name: "includeExcluded" });
  includeExcluded.checked = initial.includeExcluded;
  const threshold = numberInput("threshold", initial.threshold ?? "", { placeholder: "a quarter of the way up" });
  const read = (): RecordsSettings => ({ genotypes: genotypes.values(), channel: channel.value, fits: fits.value, fitModel: fitModel.value, includeExcluded: includeExcluded.checked, threshold: numberValue(threshold) });
  return {
    element: el(
      "div",
      {},
      genotypes.element,
      el("div", { class: "field-row" }, field("Channel", channel), field("Fit setting", fits, "one setting for all groups, never mixed; missing fits are made with it"), field("Model", fitModel, "AICc is checked either way")),
      el(
        "div",
        { class: "field-row" },
        field("Boundary threshold (a.u.)", threshold, "empty: a quarter of the way from the far-end to the source-end level"),
        el("label", { class: "check" }, includeExcluded, " also use excluded embryos"),
      ),
    ),
    read,
    body() {
      const r = read();
      return {
        selection: r.genotypes.length ? { genotypes: r.genotypes } : {},
        channel: r.channel || undefined,
        ...(r.fits ? { fits: r.fits } : {}),
        ...(r.fitModel ? { fitModel: r.fitModel } : {}),
        ...(r.includeExcluded ? { includeExcluded: true } : {}),
        ...(r.threshold !== undefined ? { threshold: r.threshold } : {}),
      };
    },
  };
}
