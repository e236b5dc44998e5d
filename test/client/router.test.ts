import { describe, expect, it } from "vitest";
import { viewFromHash } from "../../client/router.ts";

// common practice, no source: hash routes of a single-page app.
describe("viewFromHash", () => {
  it("viewFromHash reads the view from #/name and ignores anything after it", () => {
    expect(viewFromHash("#/fits")).toBe("fits");
    expect(viewFromHash("#/precision?group=wt")).toBe("precision");
    expect(viewFromHash("#groups/compare")).toBe("groups");
  });

  it("viewFromHash falls back to the Data view for an empty or unknown hash", () => {
    expect(viewFromHash("")).toBe("data");
    expect(viewFromHash("#/nowhere")).toBe("data");
  });
});
