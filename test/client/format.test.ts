import { describe, expect, it } from "vitest";
import { formatEstimate, formatEstimateInterval, formatEstimateValue, formatInterval } from "../../client/format/formatEstimate.ts";
import { formatPercent } from "../../client/format/formatPercent.ts";
import { formatPValue } from "../../client/format/formatPValue.ts";
import { formatPlain, formatSignificant } from "../../client/format/significant.ts";
import { uncertaintyDecimals } from "../../client/format/uncertaintyDecimals.ts";

describe("uncertaintyDecimals", () => {
  // Source: Particle Data Group, Review of Particle Physics, Introduction, "Rounding":
  // leading digits 100–354 keep two significant digits, 355–949 one, 950–999 round up to 1000 with two.
  it.each([
    [0.827, 1], // 827 → one digit: 0.8
    [0.0357, 2], // 357 → one digit: 0.04
    [0.0354, 3], // 354 → two digits: 0.035
    [0.996, 1], // 996 → 1.0
    [1.037, 1], // 104 → two digits: 1.0
    [4, 0], // 400 → one digit: 4
    [185.5, -1], // 186 → two digits: 190
    [46, -1], // 460 → one digit: 50
  ])("uncertaintyDecimals(%d) is %d", (u, d) => {
    expect(uncertaintyDecimals(u)).toBe(d);
  });

  it("uncertaintyDecimals gives null for a missing, zero or infinite uncertainty", () => {
    expect(uncertaintyDecimals(null)).toBeNull();
    expect(uncertaintyDecimals(0)).toBeNull();
    expect(uncertaintyDecimals(Number.POSITIVE_INFINITY)).toBeNull();
  });
});

describe("formatEstimate", () => {
  // Source: Particle Data Group rounding convention (above); the value is shown to the place of its uncertainty.
  it("formatEstimate rounds the value to the place of its standard error and appends the unit", () => {
    expect(formatEstimate({ value: 96.3, se: 4.2 }, "µm")).toBe("96 ± 4 µm");
    expect(formatEstimate({ value: 89.46030135, se: 1.0370086 }, "µm")).toBe("89.5 ± 1.0 µm");
    expect(formatEstimate({ value: 8003.1455, se: 185.54 }, "µm²")).toBe("8000 ± 190 µm²");
  });

  it("formatEstimate with ci shows the 95% CI in brackets at the same place", () => {
    expect(formatEstimate({ value: 89.46030135, se: 1.0370086, ci95: [87.4164553, 91.5041474] }, "µm", { ci: true })).toBe("89.5 ± 1.0 µm [87.4, 91.5]");
  });

  it("formatEstimate without an SE rounds on the CI width, and without either shows three significant figures", () => {
    expect(formatEstimate({ value: 21.64195, ci95: [17.9988, 26.0447] }, "µm")).toBe("21.6 µm");
    expect(formatEstimate({ value: 1.6730588 }, "bits")).toBe("1.67 bits");
  });

  it("formatEstimate writes negative numbers with a minus sign and very small values with a shared power of ten", () => {
    expect(formatEstimate({ value: -2.857959, se: 1.39 })).toBe("\u22122.9 ± 1.4");
    expect(formatEstimate({ value: 1.234e-5, se: 4.6e-7 }, "1/s")).toBe("(1.23 ± 0.05) × 10\u207b\u2075 1/s");
  });

  it("formatEstimate of a missing value is a dash", () => {
    expect(formatEstimate(null, "µm")).toBe("\u2014");
    expect(formatEstimate({ value: null, se: null }, "µm")).toBe("\u2014");
    expect(formatEstimate({ value: Number.NaN }, "µm")).toBe("\u2014");
  });

  it("formatEstimateValue and formatEstimateInterval split an estimate for two table columns", () => {
    const est = { value: 119.597, se: 1.225, ci95: [117.264, 121.877] as [number, number] };
    expect(formatEstimateValue(est)).toBe("119.6");
    expect(formatEstimateInterval(est)).toBe("[117.3, 121.9]");
    expect(formatEstimateInterval(est, "µm")).toBe("[117.3, 121.9] µm");
  });

  it("formatInterval of a missing interval is a dash", () => {
    expect(formatInterval(null, 1)).toBe("\u2014");
  });
});

describe("formatSignificant", () => {
  // common practice, no source: three significant figures, plain decimals between 0.001 and a million.
  it.each([
    [89.46030135, 3, "89.5"],
    [8003.1, 3, "8000"],
    [99.96, 3, "100"],
    [0.0243779, 2, "0.024"],
    [-0.1623, 2, "\u22120.16"],
    [0.0000123, 3, "1.23 × 10\u207b\u2075"],
    [2.5573e-8, 2, "2.6 × 10\u207b\u2078"],
    [63899.6, 3, "63900"],
    [0, 3, "0"],
  ])("formatSignificant(%d, %d) is %s", (x, n, text) => {
    expect(formatSignificant(x, n)).toBe(text);
  });

  it("formatSignificant never prints -0", () => {
    expect(formatSignificant(-0.00000, 3)).toBe("0");
    expect(formatSignificant(-0.0004, 1)).toBe("\u22124 × 10\u207b\u2074");
  });
});

describe("formatPValue", () => {
  // common practice (journal style guides report p to two significant figures and "< 0.001" below that), value from memory.
  it("formatPValue shows two significant figures, and < 0.001 below that", () => {
    expect(formatPValue(0.04197991)).toBe("0.042");
    expect(formatPValue(0.5199)).toBe("0.52");
    expect(formatPValue(0.001)).toBe("0.0010");
    expect(formatPValue(5.0257e-26)).toBe("< 0.001");
    expect(formatPValue(1)).toBe("1");
    expect(formatPValue(null)).toBe("\u2014");
  });
});

describe("formatPercent", () => {
  // common practice, no source
  it("formatPercent turns a fraction into a whole percentage", () => {
    expect(formatPercent(0.4342)).toBe("43%");
    expect(formatPercent(1)).toBe("100%");
    expect(formatPercent(0.02438, 1)).toBe("2.4%");
    expect(formatPercent(undefined)).toBe("\u2014");
  });
});

describe("formatPlain", () => {
  // common practice, no source: stored inputs (dosage, threshold, age) are shown as written, without float noise.
  it("formatPlain drops trailing zeros and floating-point noise", () => {
    expect(formatPlain(0.5)).toBe("0.5");
    expect(formatPlain(400)).toBe("400");
    expect(formatPlain(8940 / 60)).toBe("149");
    expect(formatPlain(148.99999999999)).toBe("149");
    expect(formatPlain(-2.5)).toBe("\u22122.5");
    expect(formatPlain(null)).toBe("\u2014");
  });
});
