import { ensureFitSetting } from "../../db/fitSettings.ts";
import { describe, expect, it } from "vitest";
import { openDatabaseSync } from "../../db/connection.ts";
import { listFits, storeFits } from "../../db/fits.ts";
import { PACK_MIN_LENGTH, packNumbers, unpackNumbers } from "../../db/packedNumbers.ts";
import { ImportOptions } from "../../server/import/importOptions.ts";
import { importFiles } from "../../server/services/importFiles.ts";
import { loadProfiles } from "../../db/profiles.ts";

// Stored results must read back exactly as computed (common practice, no source).
const long = (n: number, f: (i: number) => number) => Array.from({ length: n }, (_, i) => f(i));

describe("packedNumbers", () => {
  it("packNumbers then unpackNumbers gives back every number exactly, short arrays and other values untouched", () => {
    const value = {
      fit: { xUm: long(500, (i) => i * 0.1), fitted: long(500, (i) => Math.exp(-i / 37) * 123.456789 + 1e-17), n: 500, label: "e1" },
      short: [1, 2, 3],
      mixed: Array.from({ length: 40 }, (_, i): number | string => (i === 7 ? "x" : i)),
      nested: [{ residuals: long(64, (i) => -i / 3) }],
      none: null,
    };
    const packed = packNumbers(value) as { fit: { xUm: unknown }; short: unknown; mixed: unknown };
    expect(packed.fit.xUm).toEqual({ $f64: expect.any(String) });
    expect(packed.short).toEqual([1, 2, 3]);
    expect(packed.mixed).toEqual(value.mixed);
    expect(unpackNumbers(JSON.parse(JSON.stringify(packed)))).toEqual(value);
  });

  it("packNumbers leaves arrays holding NaN or Infinity as JSON would write them", () => {
    const withNaN = long(PACK_MIN_LENGTH, (i) => (i === 3 ? Number.NaN : i));
    expect(packNumbers({ a: withNaN })).toEqual({ a: withNaN });
  });

  it("storeFits packs the long arrays and listFits reads them back unchanged; results stored as plain JSON still read", () => {
    const db = openDatabaseSync(":memory:");
    const csv = "embryo,position [µm],intensity\n" + Array.from({ length: 100 }, (_, i) => `e1,${i},${200 - i}`).join("\n");
    const [report] = importFiles(db, [{ name: "f.csv", bytes: new TextEncoder().encode(csv) }], ImportOptions.parse({ genotype: "wt" }));
    expect(report.status).toBe("imported");
    const profileId = loadProfiles(db)[0].profileId;
    const result = { fit: { xUm: long(100, (i) => i), fitted: long(100, (i) => 1 / (i + 3)), residuals: long(100, (i) => Math.sin(i)) } };
    const setting = ensureFitSetting(db, { name: "exponential", model: "exponential", options: { a: 1 }, rename: false });
    storeFits(db, [{ profileId, settingId: setting.id, model: "exponential", options: { a: 1 }, engineVersion: "t", status: "converged", lambdaUm: 1, lambdaSeUm: 0.1, aicc: 1, result }]);
    const raw = db.prepare("SELECT result_json FROM fits").get() as { result_json: string };
    expect(raw.result_json).toContain('"$f64"');
    expect(listFits(db)[0].result).toEqual(result);
    db.prepare("UPDATE fits SET result_json = ?").run(JSON.stringify(result));
    expect(listFits(db)[0].result).toEqual(result);
  });
});
