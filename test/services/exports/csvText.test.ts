import { describe, expect, it } from "vitest";
import { csvText } from "../../../server/services/exports/csvText.ts";
import { runPython } from "../../helpers/python.ts";

describe("csvText", () => {
  it("csvText quotes commas, quotes and line breaks so that Python's csv module reads every cell back", async () => {
    // Source: RFC 4180, section 2 (quoting rules, CRLF line ends); Python's csv module is the outside reader.
    const table = {
      columns: ["label", "lambda_um", "note"],
      rows: [
        ["a,b", 96.12345678901234, 'said "hello"'],
        ["line\nbreak", 1e-12, "µm and ±"],
        ["plain", -0, "x\r\ny"],
      ],
    };
    const text = csvText(table);
    expect(text.endsWith("\r\n")).toBe(true);
    const rows = await runPython<string[][]>("import csv, io\nresult = list(csv.reader(io.StringIO(data, newline='')))", text);
    expect(rows).toEqual([table.columns, ...table.rows.map((r) => r.map(String))]);
  });

  it("csvText writes numbers in full, so a reader gets back the same double", async () => {
    const values = [Math.PI, 1 / 3, 123456789.123456789, 2.2250738585072014e-308];
    const read = await runPython<number[]>("import csv, io\nresult = [float(v) for v in list(csv.reader(io.StringIO(data)))[1]]", csvText({ columns: ["a", "b", "c", "d"], rows: [values] }));
    expect(read).toEqual(values);
  });

  it("csvText leaves null, undefined and non-finite numbers empty and writes booleans as words", () => {
    expect(csvText({ columns: ["a", "b", "c", "d", "e"], rows: [[null, undefined, NaN, Infinity, true]] })).toBe("a,b,c,d,e\r\n,,,,true\r\n");
  });

  it("csvText refuses a row whose length differs from the header's", () => {
    expect(() => csvText({ columns: ["a", "b"], rows: [[1]] })).toThrow("row 1 has 1 cells but there are 2 columns");
  });
});
