import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { DEMO_FILES, demoFileContents } from "../../fixtures/demoFiles.ts";
import { generateDemo, SCENARIO } from "../../fixtures/demoScenario.ts";
import { ImportOptions } from "../../server/import/importOptions.ts";
import { parseProfileFile } from "../../server/import/parseProfileFile.ts";
import type { ParsedImport } from "../../server/import/records.ts";
import { runPython } from "../helpers/python.ts";

const FIXTURES = new URL("../../fixtures/", import.meta.url);
const read = (name: string) => ({ name, bytes: readFileSync(new URL(name, FIXTURES)) });
const { main } = generateDemo();

function glmProfiles(parsed: ParsedImport) {
  return new Map(parsed.profiles.filter((p) => p.channel === "glm" || p.channel === "signal").map((p) => [p.embryo, p]));
}

describe("demo fixtures", () => {
  it("the committed fixture files are exactly what fixtures/generate.ts writes", () => {
    // common practice, no source: generated files must not drift from their generator.
    for (const [name, text] of Object.entries(demoFileContents())) {
      expect(readFileSync(new URL(name, FIXTURES), "utf8"), name).toBe(text);
    }
  });

  const shapes: [string, string, Record<string, unknown>, string | undefined, number][] = [
    ["long, comma, µm", DEMO_FILES.long, {}, undefined, 0],
    ["wide + side file, BOM, CRLF, NA cells", DEMO_FILES.wide, {}, DEMO_FILES.wideMeta, 0],
    ["long, semicolon, decimal comma, x/L", DEMO_FILES.semicolon, {}, undefined, 1e-5],
    ["wide TSV in pixels + side file", DEMO_FILES.pixels, { pixelSizeUm: SCENARIO.pixelSizeUm }, DEMO_FILES.wideMeta, 0],
  ];
  for (const [label, file, options, meta, tolUm] of shapes) {
    it(`parseProfileFile reads the ${label} demo file back to the generator's numbers`, () => {
      const parsed = parseProfileFile(read(file), ImportOptions.parse({ ...options, channel: "glm" }), meta ? read(meta) : undefined);
      const profiles = glmProfiles(parsed);
      expect(parsed.embryos).toHaveLength(main.length);
      for (const e of main) {
        const p = profiles.get(e.label)!;
        const truth = e.profiles[0];
        const kept = truth.positionsPx.map((px, i) => ({ x: px * SCENARIO.pixelSizeUm, y: truth.intensities[i] })).filter((v) => v.y !== null);
        expect(p.positionsUm.length, e.label).toBe(kept.length);
        kept.forEach((v, i) => {
          expect(Math.abs(p.positionsUm[i] - v.x)).toBeLessThanOrEqual(tolUm);
          expect(p.intensities[i]).toBe(v.y);
        });
        const embryo = parsed.embryos.find((x) => x.label === e.label)!;
        expect(embryo.genotype).toBe(e.genotype);
        expect(embryo.lengthUm).toBe(e.lengthUm);
      }
      expect(parsed.droppedCells).toHaveLength(SCENARIO.missingCells.length);
    });
  }

  it("parseProfileFile agrees with numpy.genfromtxt on the wide demo file", async () => {
    // Source: numpy.genfromtxt as an outside CSV reader (missing cells become NaN there).
    const ref = await runPython<{ x: number[]; cols: Record<string, (number | null)[]> }>(
      `
import io
raw = open(data["path"], encoding="utf-8-sig").read()
arr = np.genfromtxt(io.StringIO(raw), delimiter=",", names=True, missing_values=["NA", ""], filling_values=np.nan, deletechars="")
names = arr.dtype.names
result = {"x": arr[names[0]].tolist(), "cols": {n: [None if np.isnan(v) else float(v) for v in arr[n]] for n in names[1:]}}
`,
      { path: new URL(DEMO_FILES.wide, FIXTURES).pathname },
    );
    const parsed = parseProfileFile(read(DEMO_FILES.wide), ImportOptions.parse({}), read(DEMO_FILES.wideMeta));
    const byLabel = glmProfiles(parsed);
    const labels = Object.keys(ref.cols);
    expect(labels.length).toBe(parsed.profiles.length);
    for (const label of labels) {
      const col = ref.cols[label];
      const expected = ref.x.map((x, i) => [x, col[i]] as const).filter(([, y]) => y !== null);
      const p = byLabel.get(label)!;
      expect(Array.from(p.positionsUm)).toEqual(expected.map(([x]) => x));
      expect(Array.from(p.intensities)).toEqual(expected.map(([, y]) => y));
    }
  });
});
