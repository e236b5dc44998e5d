import { isUtf8 } from "node:buffer";
import { ImportError } from "./importError.ts";

/** Text is decoded and tokenized in pieces of this many bytes, so no copy of the whole file is made. */
export const CHUNK_BYTES = 1 << 20;

/**
 * Bytes of an exported table to text, in pieces: UTF-8 (with or without BOM)
 * or UTF-16 with a BOM; files that are not valid UTF-8 are read as
 * Windows-1252, which older spreadsheet exports use for "µ". Each call of the
 * returned function starts a new pass over the bytes.
 */
export function decodeChunks(bytes: Uint8Array, fileName: string): () => Iterable<string> {
  let encoding = "utf-8";
  let body = bytes;
  if (bytes.length >= 2 && bytes[0] === 0xff && bytes[1] === 0xfe) {
    encoding = "utf-16le";
    body = bytes.subarray(2);
  } else if (bytes.length >= 2 && bytes[0] === 0xfe && bytes[1] === 0xff) {
    encoding = "utf-16be";
    body = bytes.subarray(2);
  } else {
    if (bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) body = bytes.subarray(3);
    if (body.includes(0)) {
      throw new ImportError([{ location: { file: fileName }, message: "looks like a binary file (it contains NUL bytes), not a CSV or TSV table" }]);
    }
    if (!isUtf8(body)) encoding = "windows-1252";
  }
  return function* () {
    const decoder = new TextDecoder(encoding);
    for (let start = 0; start < body.length; start += CHUNK_BYTES) {
      const piece = decoder.decode(body.subarray(start, start + CHUNK_BYTES), { stream: start + CHUNK_BYTES < body.length });
      if (piece !== "") yield piece;
    }
  };
}

/** The whole text at once (small files: side files, previews). */
export function decodeText(bytes: Uint8Array, fileName: string): string {
  let text = "";
  for (const piece of decodeChunks(bytes, fileName)()) text += piece;
  return text;
}
