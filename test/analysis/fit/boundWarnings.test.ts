import { describe, expect, it } from "vitest";
import { boundWarnings } from "../../../server/analysis/fit/boundWarnings.ts";
import { sourceModel } from "../../../server/analysis/models/source.ts";

describe("boundWarnings", () => {
  it("warns about parameters on a bound, except a length scale on its upper bound (reported as no decay)", () => {
    // common practice, no source
    const warnings: string[] = [];
    boundWarnings(sourceModel, { free: [0, 1], lower: [0.1, 0.1], upper: [1000, 200] }, Int8Array.of(1, 1), warnings);
    expect(warnings).toEqual(["sourceWidthUm sits at its upper limit (200): the data do not determine it; fix it to a measured value"]);
    const lower: string[] = [];
    boundWarnings(sourceModel, { free: [0], lower: [0.1], upper: [1000] }, Int8Array.of(-1), lower);
    expect(lower[0]).toMatch(/^lambdaUm sits at its lower limit \(0.1\)/);
  });
});
