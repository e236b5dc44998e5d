import { apiPost } from "../../api/http.ts";
import type { SimulationResult } from "../../api/types/dynamics.ts";
import { chartPanel, destroyCharts } from "../../components/chartPanel.ts";
import { el, replaceChildren } from "../../components/el.ts";
import { field, numberInput, numberValue } from "../../components/formFields.ts";
import { keyNumbers } from "../../components/keyNumbers.ts";
import { errorNotice, infoNotice } from "../../components/notice.ts";
import { simulationFigure } from "../../figures/index.ts";
import { formatSignificant } from "../../format/significant.ts";

/** A slider over log10 of a positive quantity, with its value shown beside it. */
function logSlider(name: string, min: number, max: number, start: number, unit: string) {
  const input = el("input", { type: "range", name, min: Math.log10(min), max: Math.log10(max), step: "any", value: Math.log10(start), "data-role": `slider-${name}` });
  const shown = el("output", { for: input.id }, "");
  const value = () => 10  
    ** Number(input.value);
  const update = () => (shown.textContent = `${formatSignificant(value(), 3)} ${unit}`);
  input.addEventListener("input", update);
  update();
  return { input, shown, value };
}

/** What if: sliders for D, k and the flux; releasing one reruns the build-up on the server and redraws it. */
export function whatIfSection(): HTMLElement {
  const d = logSlider("D", 0.01, 10, 0.3, "µm²/s");
  const k = logSlider("k", 1e-5, 1e-2, 2e-4, "1/s");
  const flux = logSlider("flux", 0.1, 10, 1, "a.u.·µm/s");
  const length = numberInput("length", 500, { min: 10 });
  const hours = numberInput("until", 3, { min: 0.01 });
  const out = el("div", { "data-role": "what-if-result" });
  let pending = 0;
  const run = async () => {
    const mine = ++pending;
    try {
      const r = await apiPost<SimulationResult>("api/dynamics/simulate", {
        diffusionUm2PerS: d.value(),
        degradationPerS: k.value(),
        flux: flux.value(),
        lengthUm: numberValue(length) ?? 500,
        untilS: (numberValue(hours) ?? 3) * 3600,
        store: true,
      });
      if (mine !== pending) return;
      destroyCharts(out);
      const reached = r.fraction_of_steady_state;
      replaceChildren(
        out,
        keyNumbers([
          { label: "λ = √(D/k)", value: `${formatSignificant(r.lambda_um!.value, 3)} µm`, key: "lambda" },
          { label: "half-life ln2/k", value: `${formatSignificant(r.half_life_s!.value / 60, 3)} min`, key: "half-life" },
          { label: "τ at the source", value: `${formatSignificant(r.accumulation_time_s[0].value / 60, 3)} min`, key: "tau0" },
          { label: `reached at ${formatSignificant(reached[2].x_um, 3)} µm`, value: `${(100 * reached[2].fraction).toFixed(1)}%`, key: "reached" },
        ]),
        chartPanel("What-if build-up", simulationFigure(r), { kind: "simulation", query: { analysis: r.analysis_id ?? 0 } }),
        infoNotice(r.note),
      );
    } catch (e) {
      if (mine === pending) replaceChildren(out, errorNotice(e));
    }
  };
  for (const control of [d.input, k.input, flux.input, length, hours]) control.addEventListener("change", () => void run());
  const slider = (label: string, s: ReturnType<typeof logSlider>) => el("div", { class: "field slider" }, el("label", {}, label, " ", s.input), s.shown);
  const section = el(
    "section",
    { class: "panel", "aria-labelledby": "what-if-title", "data-section": "what-if" },
    el("h2", { id: "what-if-title" }, "What if: how long does the gradient take to form?"),
    el("p", {}, "∂c/∂t = D c″ − k c from c = 0, with an influx at x = 0 and a closed far end. A model run, not a measurement."),
    el("div", { class: "form-row" }, slider("D", d), slider("k", k), slider("flux", flux), field("Length (µm)", length), field("Run for (h)", hours)),
    out,
  );
  void run();
  return section;
}
