import { readFileSync } from "node:fs";
import type { Locator, Page } from "playwright-core";

/** Click a download link and return the file it saved, with the name the server suggested. */
export async function downloadFile(page: Page, link: Locator): Promise<{ name: string; bytes: Buffer }> {
  const [download] = await Promise.all([page.waitForEvent("download"), link.click()]);
  const path = await download.path();
  return { name: download.suggestedFilename(), bytes: readFileSync(path) };
}

/** Width and height from a PNG's IHDR chunk (Source: W3C PNG specification, sections 5.2 and 11.2.2). */
export function pngSize(bytes: Buffer): { width: number; height: number } {
  return { width: bytes.readUInt32BE(16), height: bytes.readUInt32BE(20) };
}

/** The eight-byte PNG signature (Source: W3C PNG specification, section 5.2). */
export const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
