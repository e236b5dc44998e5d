import { describe, expect, it } from "vitest";
import { selectRecords } from "../../../server/analysis/compare/selectRecords.ts";
import type { EmbryoRecord } from "../../../server/analysis/compare/embryoRecord.ts";

describe("selectRecords", () => {
  it("selectRecords keeps converged fits with positive λ and says why each other record is left out", () => {
    // common practice, no source: only converged fits with a usable λ are measurements.
    const records: EmbryoRecord[] = [
      { embryo: "a", group: "wt", lambdaUm: 90, converged: true },
      { embryo: "b", group: "wt", lambdaUm: 90, converged: false },
      { embryo: "c", group: "wt", lambdaUm: -4, converged: true },
      { embryo: "d", group: "wt", lambdaUm: 80, converged: true, status: "REJECTED" },
      { embryo: "a", group: "wt", lambdaUm: 70, converged: true },
      { embryo: "e", group: "wt", lambdaUm: 85, converged: true, status: "ok" },
    ];
    const s = selectRecords(records, ["rejected"]);
    expect(s.used.map((r) => r.embryo)).toEqual(["a", "e"]);
    expect(s.excluded.map((e) => [e.embryo, e.reason])).toEqual([
      ["b", "profile fit did not converge"],
      ["c", "λ is not a positive finite number (got -4)"],
      ["d", 'status "REJECTED" is excluded'],
      ["a", "repeated embryo label; only its first record is used"],
    ]);
  });
});
