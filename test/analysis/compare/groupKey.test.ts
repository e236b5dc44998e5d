import { describe, expect, it } from "vitest";
import { compareGroupKeys, groupKey } from "../../../server/analysis/compare/groupKey.ts";
import type { EmbryoRecord } from "../../../server/analysis/compare/embryoRecord.ts";

const rec = (extra: Partial<EmbryoRecord>): EmbryoRecord => ({ embryo: "e1", group: "wt", lambdaUm: 90, converged: true, ...extra });

describe("groupKey", () => {
  it("groupKey reads record fields first and metadata keys otherwise", () => {
    // common practice, no source.
    expect(groupKey(rec({}), "group")!.label).toBe("wt");
    expect(groupKey(rec({ metadata: { temperature: "25C" } }), "temperature")!.label).toBe("25C");
    expect(groupKey(rec({ metadata: { session: "s3" } }), "session")!.label).toBe("s3");
    expect(groupKey(rec({ session: "s1", metadata: { session: "s3" } }), "session")!.label).toBe("s1");
    expect(groupKey(rec({}), "channel")).toBeNull();
  });

  it("groupKey puts numeric values into half-open windows with clean edges", () => {
    expect(groupKey(rec({ ageS: 3599.9 }), "ageS", 600)!.label).toBe("[3000, 3600)");
    expect(groupKey(rec({ ageS: 3600 }), "ageS", 600)!.label).toBe("[3600, 4200)");
    expect(groupKey(rec({ metadata: { temp: "0.35" } }), "temp", 0.1)!.label).toBe("[0.3, 0.4)");
  });

  it("compareGroupKeys sorts numbers numerically and labels naturally", () => {
    const labels = ["line10", "line2", "wt"].map((l) => groupKey(rec({ group: l }), "group")!);
    expect(labels.sort(compareGroupKeys).map((k) => k.label)).toEqual(["line2", "line10", "wt"]);
    const windows = [7200, 600, 3600].map((a) => groupKey(rec({ ageS: a }), "ageS", 600)!);
    expect(windows.sort(compareGroupKeys).map((k) => k.sortKey)).toEqual([600, 3600, 7200]);
  });
});
