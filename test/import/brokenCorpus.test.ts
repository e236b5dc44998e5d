import { readdirSync, readFileSync } from "node:fs";
import { beforeAll, describe, expect, it } from "vitest";
import { openDatabaseSync, type Db } from "../../db/connection.ts";
import { ImportOptions, type ImportOptionsInput } from "../../server/import/importOptions.ts";
import { importFiles } from "../../server/services/importFiles.ts";
import { loadDemoData } from "../../server/services/demoData.ts";
import { databaseSnapshot } from "../helpers/databaseSnapshot.ts";

// One broken file per failure mode; each must be rejected with a message naming
// the problem (and its row/column where there is one), leaving the database untouched.
// Source of the expectations: the import rules of this project (common practice, no source).
const DIR = new URL("./broken/", import.meta.url);

const CASES: { file: string; expect: string[]; options?: ImportOptionsInput }[] = [
  { file: "01-intensity-not-a-number.csv", expect: ["row 4", 'column "intensity"', '"12,5.3" is not a number'] },
  { file: "02-position-not-a-number.csv", expect: ["row 3", 'column "position [µm]"', '"abc" is not a number'] },
  { file: "03-positions-decrease.csv", expect: ["row 5", "positions must increase", "20 (row 5) follows 30 (row 4)"] },
  { file: "04-position-duplicated.csv", expect: ["position 10 appears twice", "rows 3 and 4"] },
  { file: "05-four-points.csv", expect: ['embryo "E1"', "only 4 points", "at least 5"] },
  { file: "06-genotype-changes-within-embryo.csv", expect: ["row 4", 'has genotype "mut" here but "wt" in row 2'] },
  { file: "07-unknown-position-unit.csv", expect: ['unknown position unit "furlongs"'] },
  { file: "08-pixels-without-pixel-size.csv", expect: ["positions are in pixels", "--pixel-size"] },
  { file: "09-fraction-without-length.csv", expect: ["fractions of length", "--length"] },
  { file: "10-empty.csv", expect: ["no header and no data"] },
  { file: "11-only-comments.csv", expect: ["no header and no data"] },
  { file: "12-one-column.csv", expect: ["row 1", "the header has 1 column", "comma, semicolon, tab"] },
  { file: "13-unnamed-column.csv", expect: ["column 2 has no name"] },
  { file: "14-duplicate-column-names.csv", expect: ['column "E1"', "appears twice (columns 2 and 3)"] },
  { file: "15-value-without-header.csv", expect: ["row 3", "value in column 3, which has no header"] },
  { file: "16-empty-embryo-label.csv", expect: ["row 3", "embryo label is empty"] },
  { file: "17-binary.csv", expect: ["binary file"] },
  { file: "18-over-size-limit.csv", expect: ["over the 20 bytes limit", "--max-bytes"], options: { maxBytes: 20 } },
  { file: "19-too-many-embryos.csv", expect: ["3 embryos, more than the limit of 2", "--max-embryos"], options: { maxEmbryos: 2 } },
  { file: "20-comma-both-separator-and-decimal.csv", expect: ["a comma cannot be both the separator and the decimal mark"], options: { decimalMark: "," } },
  { file: "21-both-decimal-marks.csv", expect: ["row 3", '"1.234,5" is not a number'] },
  { file: "22-long-without-intensity.csv", expect: ["a long table needs columns for embryo, position and intensity", "intensity"], options: { format: "long" } },
  { file: "23-unknown-time-unit.csv", expect: ['unknown time unit "fortnights"'] },
  { file: "24-meta-duplicate-row.csv", expect: ["24-meta-duplicate-row.meta.csv", "row 4", 'embryo "E1" is listed twice in the side file (also row 2)'] },
  { file: "25-meta-genotype-conflict.csv", expect: ['embryo "E1" has genotype "mut" in the side file but "wt" in 25-meta-genotype-conflict.csv'] },
  { file: "26-genotype-option-conflict.csv", expect: ['genotype "wt" in the file, but --genotype says "mut"'], options: { genotype: "mut" } },
  { file: "27-negative-length.csv", expect: ["27-negative-length.meta.csv", "row 2", "length must be greater than 0"] },
  { file: "28-length-not-a-number.csv", expect: ["row 2", 'column "length [µm]"', '"long" is not a number'] },
  { file: "29-age-not-a-number.csv", expect: ["row 2", 'column "age [min]"', '"early" is not a number'] },
  { file: "30-dosage-zero.csv", expect: ["row 2", "dosage must be greater than 0"] },
  { file: "31-wide-position-not-a-number.csv", expect: ["row 4", '"ten" is not a number'] },
  { file: "32-wide-too-few-after-missing.csv", expect: ['embryo "E1"', "only 4 points"] },
  { file: "33-time-not-a-number.csv", expect: ["row 4", 'column "time [s]"', '"sixty" is not a number'] },
  { file: "34-zero-pixel-size.csv", expect: ["row 2", "pixel size must be greater than 0"] },
  { file: "35-zero-length.csv", expect: ["row 2", "length must be greater than 0"] },
  { file: "36-letter-o-for-zero.csv", expect: ["row 4", 'column "intensity"', '"8O" is not a number'] },
];

describe("import rejects broken files whole", () => {
  let db: Db;
  let before: ReturnType<typeof databaseSnapshot>;
  beforeAll(() => {
    db = openDatabaseSync(":memory:");
    loadDemoData(db);
    before = databaseSnapshot(db);
  });

  it("the corpus covers every data file in the broken folder and at least 30 failure modes", () => {
    const files = readdirSync(DIR).filter((f) => !f.endsWith(".meta.csv"));
    expect(files.sort()).toEqual(CASES.map((c) => c.file).sort());
    expect(CASES.length).toBeGreaterThanOrEqual(30);
  });

  for (const c of CASES) {
    it(`importFiles rejects ${c.file} with a message naming the problem and leaves the database unchanged`, () => {
      const metaName = c.file.replace(/\.csv$/, ".meta.csv");
      let meta;
      try {
        meta = { name: metaName, bytes: readFileSync(new URL(metaName, DIR)) };
      } catch {
        meta = undefined;
      }
      const [report] = importFiles(db, [{ name: c.file, bytes: readFileSync(new URL(c.file, DIR)) }], ImportOptions.parse(c.options ?? {}), meta);
      expect(report.status).toBe("rejected");
      if (report.status !== "rejected") return;
      const text = [report.error.message, ...report.error.issues.map((i) => `${i.path}: ${i.message}`)].join("\n");
      expect(text).toContain(c.file.startsWith("24-") || c.file.startsWith("27-") ? metaName : c.file);
      for (const fragment of c.expect) expect(text).toContain(fragment);
      expect(report.error.message).toContain("Nothing was imported");
      expect(databaseSnapshot(db)).toEqual(before);
    });
  }
});
