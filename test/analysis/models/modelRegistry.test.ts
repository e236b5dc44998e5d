import { describe, expect, it } from "vitest";
import { modelRegistry } from "../../../server/analysis/models/modelRegistry.ts";
import { modelNames } from "../../../server/analysis/models/steadyStateModel.ts";

describe("modelRegistry", () => {
  it("holds every model name, each under its own name", () => {
    // common practice, no source
    for (const name of modelNames) expect(modelRegistry[name].name).toBe(name);
    expect(Object.keys(modelRegistry).sort()).toEqual([...modelNames].sort());
  });

  it("every model's first parameter is a length scale in µm, and every parameter carries a unit", () => {
    // common practice, no source: the fitter reports "no decay" from the first parameter's upper bound.
    for (const name of modelNames) {
      const model = modelRegistry[name];
      expect(model.parameters[0].unit).toBe("µm");
      expect(model.parameters[0].name).toMatch(/Um$/);
      for (const p of model.parameters) expect(typeof p.unit).toBe("string");
      expect(model.source.length).toBeGreaterThan(10);
    }
  });

  it("every model's bounds contain its guess on a decaying profile and are positive", () => {
    // common practice, no source
    const x = Float64Array.from({ length: 101 }, (_, i) => 4 * i);
    const y = x.map((v) => 50 * Math.exp(-v / 60) + 5);
    const extent = { xMinUm: 0, xMaxUm: 400, minSpacingUm: 4, lengthUm: 400 };
    for (const name of modelNames) {
      const model = modelRegistry[name];
      const { lower, upper } = model.bounds(extent);
      const guess = model.initialGuess(x, y, extent);
      model.parameters.forEach((_, j) => {
        expect(lower[j]).toBeGreaterThan(0);
        expect(upper[j]).toBeGreaterThan(lower[j]);
        expect(guess[j]).toBeGreaterThan(0);
      });
    }
  });
});
