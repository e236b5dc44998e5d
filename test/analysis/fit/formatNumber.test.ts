import { describe, expect, it } from "vitest";
import { formatNumber } from "../../../server/analysis/fit/formatNumber.ts";

describe("formatNumber", () => {
  it("keeps four significant digits without trailing zeros", () => {
    // common practice, no source
    expect(formatNumber(123456)).toBe("123500");
    expect(formatNumber(0.000123456)).toBe("0.0001235");
    expect(formatNumber(2)).toBe("2");
    expect(formatNumber(NaN)).toBe("NaN");
  });
});
