import { describe, expect, it } from "vitest";
import { parseNumberList } from "../../client/format/parseNumberList.ts";

// common practice, no source
describe("parseNumberList", () => {
  it("parseNumberList reads numbers separated by commas, semicolons or spaces", () => {
    expect(parseNumberList("100, 150;200  0.25")).toEqual({ numbers: [100, 150, 200, 0.25], invalid: [] });
  });

  it("parseNumberList names the parts that are not numbers", () => {
    expect(parseNumberList("100, abc, 1e2, 12,5")).toEqual({ numbers: [100, 100, 12, 5], invalid: ["abc"] });
    expect(parseNumberList("")).toEqual({ numbers: [], invalid: [] });
  });
});
