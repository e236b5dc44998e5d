const SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

/**
 * Width and height from a PNG's IHDR chunk, which must come first: 8-byte
 * signature, then length (4), "IHDR" (4), width (4, big-endian), height (4).
 * Source: PNG specification (W3C / ISO/IEC 15948), sections 5.2 and 11.2.2.
 */
export function pngSize(png: Buffer): { width: number; height: number } {
  if (!SIGNATURE.every((b, i) => png[i] === b)) throw new Error("not a PNG: bad signature");
  if (png.toString("ascii", 12, 16) !== "IHDR") throw new Error("not a PNG: IHDR is not the first chunk");
  return { width: png.readUInt32BE(16), height: png.readUInt32BE(20) };
}
