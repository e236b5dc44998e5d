import { ImportError } from "./importError.ts";

/**
 * Bytes of an exported table to text: UTF-8 (with or without BOM) or UTF-16
 * with a BOM; files that are not valid UTF-8 are read as Windows-1252, which
 * older spreadsheet exports use for "µ".
 */
export function decodeText(bytes: Uint8Array, fileName: string): string {
  if (bytes.length >= 2 && bytes[0] === 0xff && bytes[1] === 0xfe) return new TextDecoder("utf-16le").decode(bytes.subarray(2));
  if (bytes.length >= 2 && bytes[0] === 0xfe && bytes[1] === 0xff) return new TextDecoder("utf-16be").decode(bytes.subarray(2));
  let body = bytes;
  if (bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) body = bytes.subarray(3);
  if (body.includes(0)) {
    throw new ImportError([{ location: { file: fileName }, message: "looks like a binary file (it contains NUL bytes), not a CSV or TSV table" }]);
  }
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(body);
  } catch {
    return new TextDecoder("windows-1252").decode(body);
  }
}
