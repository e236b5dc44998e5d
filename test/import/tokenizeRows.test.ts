import { describe, expect, it } from "vitest";
import { ImportOptions } from "../../server/import/importOptions.ts";
import { parseProfileFile } from "../../server/import/parseProfileFile.ts";
import { CHUNK_BYTES, decodeChunks } from "../../server/import/decodeText.ts";
import { tokenizeRows, type Delimiter } from "../../server/import/tokenizeRows.ts";
import { isUserError } from "../../server/userError.ts";
import { createRandom } from "../../server/analysis/random/seededRandom.ts";

// Quoting rules of delimited text: RFC 4180 (quoted cells may hold separators, doubled quotes and
// line breaks); CR, LF and CRLF line ends and # comment lines as spreadsheet exports write them
// (common practice, no source).
const rows = (text: string | string[], delimiter: Delimiter = ",") =>
  [...tokenizeRows(typeof text === "string" ? [text] : text, delimiter, "t.csv")].map((r) => [r.line, r.cells]);

describe("tokenizeRows", () => {
  it("tokenizeRows reads quoted separators, doubled quotes and line breaks inside quotes, numbering rows by their first line", () => {
    // Source: RFC 4180, section 2, rules 5–7.
    expect(rows('a,b,c\n"x, y","say ""hi""","two\nlines"\n3,4,5\n')).toEqual([
      [1, ["a", "b", "c"]],
      [2, ["x, y", 'say "hi"', "two\nlines"]],
      [4, ["3", "4", "5"]],
    ]);
  });

  it("tokenizeRows treats CR, LF and CRLF alike, trims unquoted cells and keeps a last line without a line end", () => {
    expect(rows("a; b \r1;2\r\n3;4\n 5 ;6", ";")).toEqual([
      [1, ["a", "b"]],
      [2, ["1", "2"]],
      [3, ["3", "4"]],
      [4, ["5", "6"]],
    ]);
  });

  it("tokenizeRows skips # comment lines whole, even when they hold a lone quote", () => {
    expect(rows('# exported by "the scope\nx,y\n  # note, "half\n1,2\n')).toEqual([
      [2, ["x", "y"]],
      [4, ["1", "2"]],
    ]);
  });

  it("tokenizeRows rejects a quote that is never closed, naming the row where it opened, instead of reading the rest of the file as one cell", () => {
    const text = 'embryo,x,y\ne1,0,1\ne1,1,"2\ne1,2,3\ne1,3,4\n';
    let caught: unknown;
    try {
      rows(text);
    } catch (e) {
      caught = e;
    }
    expect(isUserError(caught)).toBe(true);
    expect((caught as Error).message).toContain("t.csv, row 3");
    expect((caught as Error).message).toContain("never closed");
  });

  it("tokenizeRows gives the same rows whatever the pieces the text arrives in", () => {
    const random = createRandom(11);
    const text = 'h1,h2,h3\r\n"a\r\nb",2,3\n# c "x\n4,"5,""6""",7\r8,9,10\n\n11,12,"13"';
    const whole = rows(text);
    for (let trial = 0; trial < 200; trial++) {
      const pieces: string[] = [];
      let start = 0;
      while (start < text.length) {
        const len = 1 + Math.floor(random.uniform() * 6);
        pieces.push(text.slice(start, start + len));
        start += len;
      }
      expect(rows(pieces)).toEqual(whole);
    }
  });
});

describe("decodeChunks", () => {
  it("decodeChunks splits large UTF-8 text into pieces without breaking a multi-byte character", () => {
    const line = "e1,µm,ü\n";
    const text = line.repeat(Math.ceil((CHUNK_BYTES * 2.5) / Buffer.byteLength(line)));
    const pieces = [...decodeChunks(new TextEncoder().encode(text), "t.csv")()];
    expect(pieces.length).toBe(3);
    expect(pieces.join("")).toBe(text);
  });
});

describe("parseProfileFile with an unclosed quote", () => {
  it("parseProfileFile rejects the file with the row of the stray quote", () => {
    const text = 'embryo,position [µm],intensity\n' + [0, 1, 2, 3, 4, 5].map((i) => `E1,${i * 10},${i === 2 ? '"' : ""}${100 - i}`).join("\n");
    expect(() => parseProfileFile({ name: "q.csv", bytes: new TextEncoder().encode(text) }, ImportOptions.parse({}))).toThrow(/q\.csv, row 4: a quote \(\"\) opens a cell here that is never closed/);
  });
});
