import { describe, expect, it } from "vitest";
import { formatInterval, formatNumber, formatWithError, roundSignificant } from "../../client/figures/figureNumbers.ts";

// Rounding conventions for text in figures: the value to the digits its SE supports (common practice, no source).
describe("figure numbers", () => {
  it("formatWithError keeps two significant figures of the SE and the value to the same decimals", () => {
    expect(formatWithError(96.349, 4.21, "µm")).toBe("96.3 ± 4.2 µm");
    expect(formatWithError(96.349, 14.2, "µm")).toBe("96 ± 14 µm");
    expect(formatWithError(0.012345, 0.00123)).toBe("0.0123 ± 0.0012");
    expect(formatWithError(96.349, null, "µm")).toBe("96.3 µm");
    expect(formatWithError(96.349, 0, "µm")).toBe("96.3 µm");
  });

  it("formatNumber gives three significant figures without an exponent for everyday magnitudes", () => {
    expect(formatNumber(12.3456)).toBe("12.3");
    expect(formatNumber(0.0012345)).toBe("0.00123");
    expect(formatNumber(12345)).toBe("12345");
    expect(formatNumber(NaN)).toBe("—");
    expect(formatInterval([1.234, 5.678])).toBe("[1.23, 5.68]");
    expect(formatInterval(null)).toBe("");
  });

  it("roundSignificant rounds to six significant figures and leaves 0 and non-finite values alone", () => {
    expect(roundSignificant(1 / 3)).toBe(0.333333);
    expect(roundSignificant(123456789)).toBe(123457000);
    expect(roundSignificant(0)).toBe(0);
    expect(roundSignificant(NaN)).toBeNaN();
  });
});
