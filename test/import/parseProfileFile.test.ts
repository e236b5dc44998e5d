import { describe, expect, it } from "vitest";
import { ImportOptions, type ImportOptionsInput } from "../../server/import/importOptions.ts";
import { parseProfileFile } from "../../server/import/parseProfileFile.ts";
import { splitHeaderUnit } from "../../server/import/columnRoles.ts";

const enc = (s: string) => new TextEncoder().encode(s);
const parse = (text: string | Uint8Array, options: ImportOptionsInput = {}, meta?: string) =>
  parseProfileFile(
    { name: "t.csv", bytes: typeof text === "string" ? enc(text) : text },
    ImportOptions.parse(options),
    meta === undefined ? undefined : { name: "m.csv", bytes: enc(meta) },
  );
const rows5 = (f: (i: number) => string) => [0, 1, 2, 3, 4].map(f).join("\n");

// Expectations below follow the import rules stated in the README (common practice, no source).
describe("splitHeaderUnit", () => {
  it("reads units written in brackets, parentheses, suffixes and x/L", () => {
    expect(splitHeaderUnit("position [µm]")).toEqual({ name: "position", unitText: "µm" });
    expect(splitHeaderUnit("x (px)")).toEqual({ name: "x", unitText: "px" });
    expect(splitHeaderUnit("x/L")).toEqual({ name: "x", unitText: "x/l" });
    expect(splitHeaderUnit("position_um")).toEqual({ name: "position", unitText: "um" });
    expect(splitHeaderUnit("Age_min")).toEqual({ name: "age", unitText: "min" });
    expect(splitHeaderUnit("Distance")).toEqual({ name: "distance", unitText: null });
  });
});

describe("parseProfileFile", () => {
  it("matches column names case-insensitively, with common variants", () => {
    const r = parse(`Sample;DIST (µm);Grey Value\n${rows5((i) => `e1;${i * 10};${100 - i}`)}`);
    expect(r.format).toBe("long");
    expect(r.delimiter).toBe(";");
    expect(Array.from(r.profiles[0].positionsUm)).toEqual([0, 10, 20, 30, 40]);
  });

  it("reads decimal commas in semicolon files, a BOM, CRLF line ends, # comments and trailing empty columns", () => {
    const text = "\uFEFF# exported 2026-11-30\r\nposition [µm];E1;;\r\n" + [0, 1, 2, 3, 4].map((i) => `${i},5;${100 - i},25;;`).join("\r\n") + "\r\n\r\n\r\n";
    const r = parse(text);
    expect(r.format).toBe("wide");
    expect(r.decimalMark).toBe(",");
    expect(Array.from(r.profiles[0].positionsUm)).toEqual([0.5, 1.5, 2.5, 3.5, 4.5]);
    expect(Array.from(r.profiles[0].intensities)).toEqual([100.25, 99.25, 98.25, 97.25, 96.25]);
  });

  it("reads tab-separated files and UTF-16 files with a BOM", () => {
    const text = `x (µm)\tE1\n${rows5((i) => `${i}\t${9 - i}`)}`;
    expect(parse(text).delimiter).toBe("\t");
    const utf16 = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, "utf16le")]);
    expect(Array.from(parse(utf16).profiles[0].intensities)).toEqual([9, 8, 7, 6, 5]);
  });

  it("drops NaN, NA and empty cells per point, reports them, and never turns them into 0", () => {
    const r = parse(`position [µm],E1,E2\n0,10,NaN\n1,9,8\n2,,7\n3,NA,6\n4,6,5\n5,5,4\n6,4,3`);
    const e1 = r.profiles.find((p) => p.embryo === "E1")!;
    expect(Array.from(e1.positionsUm)).toEqual([0, 1, 4, 5, 6]);
    expect(e1.droppedPoints).toBe(2);
    expect(r.droppedCells.map((d) => [d.row, d.column])).toEqual([[2, "E2"], [4, "E1"], [5, "E1"]]);
    expect(r.warnings.find((w) => w.code === "missing-cells")!.message).toContain("3 empty, NaN or NA cells were dropped");
  });

  it("converts pixels with the pixel size and fractions of length with the length, keeping the raw positions", () => {
    const px = parse(`x (px),E1\n${rows5((i) => `${i * 8},${10 - i}`)}`, { pixelSizeUm: 0.5 });
    expect(Array.from(px.profiles[0].positionsUm)).toEqual([0, 4, 8, 12, 16]);
    expect(Array.from(px.profiles[0].positionsRaw)).toEqual([0, 8, 16, 24, 32]);
    expect(px.profiles[0].positionUnit).toBe("px");
    const frac = parse(`embryo,x/L,intensity,length [mm]\n${rows5((i) => `E1,${i / 10},${10 - i},0.5`)}`);
    expect(frac.embryos[0].lengthUm).toBe(500);
    expect(Array.from(frac.profiles[0].positionsUm)).toEqual([0, 50, 100, 150, 200]);
    expect(frac.profiles[0].positionUnit).toBe("fraction");
  });

  it("joins a metadata side file to a wide table, keeping unknown columns as metadata", () => {
    const r = parse(`position [µm],E1,E2\n${rows5((i) => `${i},${10 - i},${20 - i}`)}`, {}, "embryo,genotype,stage,age [h],microscope\nE1,wt,S10,2.5,scope-A\nE2,mut,S11,3,scope-B\n");
    expect(r.embryos.map((e) => [e.label, e.genotype, e.stage, e.ageS, e.metadata.microscope])).toEqual([
      ["E1", "wt", "S10", 9000, "scope-A"],
      ["E2", "mut", "S11", 10800, "scope-B"],
    ]);
  });

  it("keeps separate profiles per channel and time point in a long table", () => {
    const lines = ["embryo,channel,time [min],position [µm],intensity"];
    for (const ch of ["a", "b"]) for (const t of [1, 2]) for (let i = 0; i < 5; i++) lines.push(`E1,${ch},${t},${i},${10 - i}`);
    const r = parse(lines.join("\n"));
    expect(r.profiles.map((p) => [p.channel, p.timeS])).toEqual([["a", 60], ["a", 120], ["b", 60], ["b", 120]]);
  });

  it("warns about saturated plateaus, rising profiles and negative intensities without rejecting the file", () => {
    const r = parse(`position [µm],SAT,RISE,NEG\n${[0, 1, 2, 3, 4, 5, 6, 7].map((i) => `${i},${i < 3 ? 4095 : 4000 - i * 100},${i * 10},${5 - i}`).join("\n")}`);
    const codes = Object.fromEntries(r.warnings.map((w) => [w.code, w.embryos]));
    expect(codes.saturated).toEqual(["SAT"]);
    expect(codes.rising).toEqual(["RISE"]);
    expect(codes.negative).toEqual(["NEG"]);
    expect(r.warnings.find((w) => w.code === "rising")!.hint).toContain("--flip auto");
  });

  it("with flip auto reverses a rising profile about the embryo's far end and marks it flipped", () => {
    const r = parse(`embryo,length [µm],position [µm],intensity\n${rows5((i) => `E1,100,${i * 10},${i}`)}`, { flip: "auto" });
    const p = r.profiles[0];
    expect(p.flipped).toBe(true);
    expect(Array.from(p.positionsUm)).toEqual([60, 70, 80, 90, 100]);
    expect(Array.from(p.intensities)).toEqual([4, 3, 2, 1, 0]);
  });

  it("assumes µm for a position header without a unit and says so", () => {
    const r = parse(`embryo,x,intensity\n${rows5((i) => `E1,${i},${10 - i}`)}`);
    expect(r.warnings.find((w) => w.code === "assumed-unit")!.message).toContain('"x" names no unit');
  });

  it("applies the label prefix to data and side file alike", () => {
    const r = parse(`position [µm],1\n${rows5((i) => `${i},${10 - i}`)}`, { labelPrefix: "run2-" }, "embryo,genotype\n1,wt\n");
    expect(r.embryos[0]).toMatchObject({ label: "run2-1", genotype: "wt" });
  });
});
