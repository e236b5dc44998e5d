import { describe, expect, it } from "vitest";
import { fromBlob, toBlob } from "../../db/floatBlob.ts";

describe("floatBlob", () => {
  it("toBlob writes IEEE 754 binary64 little-endian bytes", () => {
    // Source: IEEE 754-2008, binary64: 1.0 = 0x3FF0000000000000, -2.5 = 0xC004000000000000.
    expect([...toBlob([1, -2.5])]).toEqual([0, 0, 0, 0, 0, 0, 0xf0, 0x3f, 0, 0, 0, 0, 0, 0, 0x04, 0xc0]);
  });

  it("toBlob copies: changing the array afterwards leaves the blob as it was", () => {
    const v = new Float64Array([1, 2, 3]);
    const blob = toBlob(v);
    v[0] = 99;
    expect(Array.from(fromBlob(blob))).toEqual([1, 2, 3]);
  });

  it("fromBlob reads a blob that starts at an odd byte offset of its buffer, and keeps NaN, ±Infinity and -0", () => {
    const values = [Number.NaN, Infinity, -Infinity, -0, 1e-300, 123.456];
    const inner = toBlob(values);
    const shifted = Buffer.alloc(inner.length + 3);
    inner.copy(shifted, 3);
    const back = fromBlob(shifted.subarray(3));
    expect(Array.from(back)).toEqual(values);
    expect(Object.is(back[3], -0)).toBe(true);
  });

  it("fromBlob rejects a blob that is not a whole number of values", () => {
    expect(() => fromBlob(Buffer.alloc(12))).toThrow(/not a whole number/);
  });
});
