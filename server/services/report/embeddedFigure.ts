import { escapeHtml } from "./escapeHtml.ts";

/** A rendered figure: a PNG for the page (embedded as a data URI, so the page needs no other file) and the files written for it. */
export interface EmbeddedFigure {
  section: string;
  kind: string;
  title: string;
  caption: string;
  /** PNG at 150 dpi: sharp on high-density screens at a fraction of the 300 dpi file's size. */
  png: Buffer;
  pngPath: string;
  svgPath: string;
}

/** The figure as an <img> with a data-URI PNG, shown at the figure's size of 650 × 400 CSS pixels. */
export function figureHtml(f: EmbeddedFigure): string {
  return `<figure><img alt="${escapeHtml(f.title)}" width="650" height="400" src="data:image/png;base64,${f.png.toString("base64")}"><figcaption>${escapeHtml(f.caption)} <span class="files">Files: ${escapeHtml(f.pngPath)} (300 dpi), ${escapeHtml(f.svgPath)}</span></figcaption></figure>`;
}
