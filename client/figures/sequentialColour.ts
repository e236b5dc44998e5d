import { BACKGROUND, SERIES_COLOURS } from "./palette.ts";

/** Light-to-dark ramp in the palette's blues (no red/green), readable in grey print and with colour blindness. */
const STOPS = [BACKGROUND, "#c6e0f0", SERIES_COLOURS[2], SERIES_COLOURS[0], "#0d2f52"];

const rgb = (hex: string) => {
  const n = parseInt(hex.slice(1), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
};

/** Colour of t in [0, 1] on the sequential ramp (clamped), as "rgb(r, g, b)". */
export function sequentialColour(t: number): string {
  const u = Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0)) * (STOPS.length - 1);
  const k = Math.min(STOPS.length - 2, Math.floor(u));
  const f = u - k;
  const [a, b] = [rgb(STOPS[k]), rgb(STOPS[k + 1])];
  const c = a.map((v, i) => Math.round(v + (b[i] - v) * f));
  return `rgb(${c[0]}, ${c[1]}, ${c[2]})`;
}
