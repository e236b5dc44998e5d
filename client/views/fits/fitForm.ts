import type { Choices } from "../../api/fetchChoices.ts";
import { apiPost } from "../../api/http.ts";
import type { FitJobResult } from "../../api/types/fits.ts";
import type { JobView } from "../../api/types/job.ts";
import { el } from "../../components/el.ts";
import { button, checkboxGroup, field, numberInput, numberValue, select, textInput } from "../../components/formFields.ts";
import { runJob } from "../../components/jobProgress.ts";
import { warningNotice } from "../../components/notice.ts";
import { fitsState } from "./fitsState.ts";

const MODELS: [string, string][] = [
  ["exponential", "exponential (semi-infinite)"],
  ["finite", "finite tissue, no-flux far end"],
  ["source", "source of finite width"],
  ["power", "power law (degradation ∝ c²)"],
  ["power-free", "power law, free exponent"],
];

/**
 * The fit settings and the Fit button. Starts a fit job, shows its progress,
 * and calls `onDone` with the result; `onSelectionChange` when the genotype or
 * channel changes (the table follows them).
 */
export function fitForm(choices: Choices, onSelectionChange: () => void, onDone: (r: FitJobResult) => void): HTMLElement {
  const genotype = select("genotype", [["", "all genotypes"], ...choices.genotypes.map((g): [string, string] => [g, g])], fitsState.genotype);
  const channel = select("channel", [["", "all channels"], ...choices.channels.map((c): [string, string] => [c, c])], fitsState.channel);
  const models = checkboxGroup("Models (several are ranked by AICc)", "models", MODELS, fitsState.models);
  const xMin = numberInput("xMinUm", fitsState.xMinUm ?? "", { min: 0, placeholder: "start of profile" });
  const xMax = numberInput("xMaxUm", fitsState.xMaxUm ?? "", { min: 0, placeholder: "end of profile" });
  const settingName = textInput("as", "", "generated from the options");
  const global = el("input", { type: "checkbox", id: "fit-global", name: "global" });
  global.checked = fitsState.global;
  const progress = el("div", { "data-role": "fit-progress" });

  const read = () => {
    fitsState.genotype = genotype.value;
    fitsState.channel = channel.value;
    fitsState.models = models.values();
    fitsState.xMinUm = numberValue(xMin);
    fitsState.xMaxUm = numberValue(xMax);
    fitsState.global = global.checked;
  };
  genotype.addEventListener("change", () => {
    read();
    onSelectionChange();
  });
  channel.addEventListener("change", () => {
    read();
    onSelectionChange();
  });

  const start = async () => {
    read();
    const window = fitsState.xMinUm !== undefined || fitsState.xMaxUm !== undefined ? { xMinUm: fitsState.xMinUm, xMaxUm: fitsState.xMaxUm } : undefined;
    const body = {
      selection: { genotype: fitsState.genotype || undefined, channel: fitsState.channel || undefined },
      models: fitsState.models.length ? fitsState.models : ["exponential"],
      options: window ? { window } : {},
      ...(settingName.value.trim() ? { as: settingName.value.trim() } : {}),
      global: fitsState.global,
    };
    run.disabled = true;
    const result = await runJob<FitJobResult>(progress, "Fitting", () => apiPost<JobView>("api/fits", body));
    run.disabled = false;
    if (result) {
      fitsState.lastJob = result;
      progress.replaceChildren(
        el("p", { class: "muted", "data-role": "fit-done" }, `Fitted ${result.fits.length} profile × model combinations${result.global.length ? ` and ${result.global.length} global fits` : ""}, under fit setting ${(result.settings ?? []).map((st) => `${st.name} (${st.description})`).join(", ")}.`),
        ...(result.groups ?? []).map((g) =>
          g.warning
            ? warningNotice(`${g.genotype} / ${g.channel}: ${g.warning}`)
            : el("p", { class: "muted", "data-role": "model-preference" }, `${g.genotype} / ${g.channel}: ${g.model_preference.message}.`),
        ),
      );
      onDone(result);
    }
  };
  const run = button("Fit", () => void start(), "primary", { "data-role": "start-fit" });

  return el(
    "div",
    { class: "fit-form" },
    el("div", { class: "field-row" }, field("Genotype", genotype), field("Channel", channel), field("Window from (µm)", xMin), field("Window to (µm)", xMax), field("Name of this fit setting", settingName, "group analyses choose fits by this name")),
    models.element,
    el("label", { for: "fit-global", class: "check" }, global, " Also fit each genotype × channel group globally (one shared λ, per-embryo amplitude and background)"),
    el("div", { class: "actions" }, run),
    progress,
  );
}
