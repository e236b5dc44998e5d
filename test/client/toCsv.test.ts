import { describe, expect, it } from "vitest";
import { toCsv } from "../../client/format/toCsv.ts";

describe("toCsv", () => {
  // Source: RFC 4180, section 2 (quoting, doubled quotes, CRLF line ends).
  it("toCsv quotes cells holding a comma, quote or line break, and doubles inner quotes", () => {
    expect(toCsv(["embryo", "note"], [["wt-01", 'said "flat", then\nrose']])).toBe('embryo,note\r\nwt-01,"said ""flat"", then\nrose"\r\n');
  });

  it("toCsv writes numbers as they are and missing or non-finite values as empty cells", () => {
    expect(toCsv(["a", "b", "c", "d"], [[89.46030135409568, null, Number.NaN, -2.5]])).toBe("a,b,c,d\r\n89.46030135409568,,,-2.5\r\n");
  });

  // Source: OWASP, "CSV Injection" (prefix cells that start with = + - @ so spreadsheets keep them as text).
  it("toCsv keeps a label that looks like a formula as text, but leaves negative numbers written as text alone", () => {
    expect(toCsv(["label"], [["=1+2"], ["@SUM(A1)"], ["-12.5"], ["+x"]])).toBe("label\r\n'=1+2\r\n'@SUM(A1)\r\n-12.5\r\n'+x\r\n");
  });
});
