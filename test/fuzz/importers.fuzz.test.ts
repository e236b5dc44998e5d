import { readFileSync } from "node:fs";
import Database from "better-sqlite3";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { openDatabaseSync } from "../../db/connection.ts";
import { ImportOptions } from "../../server/import/importOptions.ts";
import { importFiles } from "../../server/services/importFiles.ts";
import { databaseSnapshot } from "../helpers/databaseSnapshot.ts";
import { CASE_TIME_LIMIT_MS, FUZZ_RUNS, FUZZ_SEED } from "./fuzzSettings.ts";

// Property-based checks of every importer: whatever the bytes, a clear answer and no partial write (common practice, no source).

const SPECIAL = ["NaN", "nan", "NA", "-", "", "Inf", "-Infinity", "1e308", "1e-320", "-0", "0x1F", "1,5", "1.234,5", "١٢٣", "∞", " 12 ", "+.5", "5."];
const HOSTILE = ["<script>alert(1)</script>", "'; DROP TABLE profiles; --", '"quoted, with comma"', "tab\there", "line\nbreak", "ĝénotype", "🐟", "\u0000", "../../etc/passwd", "=HYPERLINK(\"x\")", "a".repeat(300)];
const HEADERS = ["position [µm]", "x (px)", "x/L", "position [mm]", "embryo", "genotype", "channel", "intensity", "stage", "age [min]", "length [µm]", "dosage", "session", "time [s]", "x", "pos"];

const cell = fc.oneof(
  { weight: 4, arbitrary: fc.double({ noNaN: false }).map(String) },
  { weight: 3, arbitrary: fc.integer({ min: -1e6, max: 1e6 }).map(String) },
  { weight: 2, arbitrary: fc.constantFrom(...SPECIAL) },
  { weight: 1, arbitrary: fc.constantFrom(...HOSTILE) },
  { weight: 1, arbitrary: fc.string({ maxLength: 20 }) },
  { weight: 1, arbitrary: fc.integer({ min: 1000, max: 20_000 }).map((n) => "9".repeat(n) + "x") },
);
const header = fc.oneof({ weight: 3, arbitrary: fc.constantFrom(...HEADERS) }, { weight: 1, arbitrary: fc.constantFrom(...HOSTILE) }, { weight: 1, arbitrary: fc.string({ maxLength: 12 }) });
const delimiter = fc.constantFrom(",", ";", "\t");

/** A random table: a header of known and odd names, then rows of numbers, special values, hostile text and huge cells. */
const table = fc
  .record({ cols: fc.integer({ min: 1, max: 8 }), rows: fc.integer({ min: 0, max: 30 }), delimiter, newline: fc.constantFrom("\n", "\r\n", "\r") })
  .chain(({ cols, rows, delimiter, newline }) =>
    fc.record({
      head: fc.array(header, { minLength: cols, maxLength: cols }),
      body: fc.array(fc.array(cell, { minLength: 0, maxLength: cols + 1 }), { minLength: rows, maxLength: rows }),
      delimiter: fc.constant(delimiter),
      newline: fc.constant(newline),
    }),
  )
  .map(({ head, body, delimiter, newline }) => [head, ...body].map((r) => r.join(delimiter)).join(newline) + newline);

/** Text in one of the encodings the importer meets: UTF-8 with or without BOM, UTF-16 with BOM, Latin-1 bytes, or raw noise. */
const encoded = (text: fc.Arbitrary<string>) =>
  fc.tuple(text, fc.constantFrom("utf8", "utf8-bom", "utf16le", "utf16be", "latin1", "noise")).chain(([t, e]) => {
    if (e === "noise") return fc.uint8Array({ maxLength: 2000 });
    const utf8 = new TextEncoder().encode(t);
    if (e === "utf8") return fc.constant(utf8);
    if (e === "utf8-bom") return fc.constant(new Uint8Array([0xef, 0xbb, 0xbf, ...utf8]));
    if (e === "latin1") return fc.constant(Uint8Array.from(t, (c) => c.charCodeAt(0) & 0xff));
    const le = new Uint8Array(2 + t.length * 2);
    le.set(e === "utf16le" ? [0xff, 0xfe] : [0xfe, 0xff]);
    for (let i = 0; i < t.length; i++) {
      const c = t.charCodeAt(i);
      le[2 + 2 * i + (e === "utf16le" ? 0 : 1)] = c & 0xff;
      le[2 + 2 * i + (e === "utf16le" ? 1 : 0)] = c >> 8;
    }
    return fc.constant(le);
  });

/** A real export, mutated: bytes cut out, random text put in, lines swapped, or the end cut off. */
const WIDE = readFileSync("fixtures/glimmerin_wide.csv", "utf8").split("\n").slice(0, 40).join("\n");
const META = readFileSync("fixtures/glimmerin_wide_meta.csv", "utf8");
const mutated = (source: string) =>
  fc.array(
    fc.oneof(
      fc.record({ kind: fc.constant("cut" as const), at: fc.nat(), len: fc.integer({ min: 1, max: 200 }) }),
      fc.record({ kind: fc.constant("insert" as const), at: fc.nat(), text: fc.oneof(cell, header, fc.constantFrom(",", ";", "\n", '"')) }),
      fc.record({ kind: fc.constant("truncate" as const), at: fc.nat() }),
    ),
    { minLength: 1, maxLength: 6 },
  ).map((ops) => {
    let t = source;
    for (const op of ops) {
      const at = op.at % (t.length + 1);
      if (op.kind === "cut") t = t.slice(0, at) + t.slice(at + op.len);
      else if (op.kind === "insert") t = t.slice(0, at) + op.text + t.slice(at);
      else t = t.slice(0, at);
    }
    return t;
  });

const options = fc.record({
  format: fc.constantFrom("auto", "long", "wide"),
  delimiter: fc.constantFrom("auto", ",", ";", "\t"),
  decimalMark: fc.constantFrom("auto", ".", ","),
  positionUnit: fc.constantFrom("auto", "um", "px", "fraction"),
  pixelSizeUm: fc.option(fc.oneof(fc.double({ min: 1e-300, max: 1e300, noNaN: true }), fc.constant(0.5)), { nil: undefined }),
  lengthUm: fc.option(fc.double({ min: 1e-6, max: 1e9, noNaN: true }), { nil: undefined }),
  genotype: fc.option(fc.constantFrom("wt", "tardy", ...HOSTILE.slice(0, 6)), { nil: undefined }),
  labelPrefix: fc.constantFrom("", "run2-", "<b>"),
  flip: fc.constantFrom("none", "auto"),
});

/**
 * Import into a database that already holds one file: the call must not
 * throw or hang, every refusal must carry a short message, and a refused
 * file must leave the database exactly as it was.
 */
const TEMPLATE = (() => {
  const db = openDatabaseSync(":memory:");
  importFiles(db, [{ name: "base.csv", bytes: new TextEncoder().encode(WIDE) }], ImportOptions.parse({ genotype: "wt" }));
  const image = db.serialize();
  db.close();
  return image;
})();

function checkImport(bytes: Uint8Array, opts: Record<string, unknown>, meta?: Uint8Array): void {
  const db = new Database(TEMPLATE);
  db.pragma("foreign_keys = ON");
  const before = databaseSnapshot(db);
  const parsedOptions = ImportOptions.safeParse(Object.fromEntries(Object.entries(opts).filter(([, v]) => v !== undefined)));
  if (!parsedOptions.success) return;
  const t0 = performance.now();
  const [report] = importFiles(db, [{ name: "fuzz.csv", bytes }], parsedOptions.data, meta ? { name: "meta.csv", bytes: meta } : undefined);
  expect(performance.now() - t0).toBeLessThan(CASE_TIME_LIMIT_MS);
  if (report.status === "rejected") {
    expect(report.error.message.length).toBeGreaterThan(10);
    expect(report.error.message.length).toBeLessThan(1500);
    expect(report.error.message).not.toMatch(/undefined|\[object Object\]|TypeError|at .*\.ts:\d+/);
    expect(databaseSnapshot(db)).toEqual(before);
  } else {
    expect(db.pragma("foreign_key_check")).toEqual([]);
  }
  db.close();
}

describe(`importers under random input (${FUZZ_RUNS} cases per property, seed ${FUZZ_SEED})`, () => {
  it("random tables in every encoding, with every option, are imported or refused cleanly", () => {
    fc.assert(fc.property(encoded(table), options, (bytes, opts) => checkImport(bytes, opts)), { numRuns: FUZZ_RUNS, seed: FUZZ_SEED });
  }, 600_000);

  it("mutated real exports are imported or refused cleanly", () => {
    fc.assert(fc.property(mutated(WIDE), options, (text, opts) => checkImport(new TextEncoder().encode(text), opts)), { numRuns: FUZZ_RUNS, seed: FUZZ_SEED + 1 });
  }, 600_000);

  it("random and mutated metadata side files are joined or refused cleanly", () => {
    fc.assert(
      fc.property(fc.oneof(mutated(META), table), (meta) => checkImport(new TextEncoder().encode(WIDE.replaceAll("wt-", "m-")), { genotype: undefined }, new TextEncoder().encode(meta))),
      { numRuns: FUZZ_RUNS, seed: FUZZ_SEED + 2 },
    );
  }, 600_000);
});
