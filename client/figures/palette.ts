/**
 * morphogauge's colours: eight hues chosen to stay distinguishable for the
 * common forms of colour blindness (blue–orange contrast first, no red/green
 * pairs, and lightness steps between neighbours). Every figure takes its
 * colours from here.
 */
export const SERIES_COLOURS = [
  "#1b5e9e", // deep blue
  "#e3860b", // amber
  "#5aa9d6", // sky
  "#8c3b6e", // plum
  "#2e8b6e", // sea green (paired with blue/amber, never with red)
  "#c4a400", // mustard
  "#5f4b9b", // indigo
  "#7a7a7a", // grey
] as const;

export const INK = "#1d232b";
export const GRID = "#d9dcd6";
export const BAND_ALPHA = 0.18;
export const BACKGROUND = "#ffffff";

/** Colour of the i-th series (wraps around). */
export function seriesColour(i: number): string {
  return SERIES_COLOURS[((i % SERIES_COLOURS.length) + SERIES_COLOURS.length) % SERIES_COLOURS.length];
}

/** The same colour with an alpha, for confidence bands. */
export function withAlpha(hex: string, alpha: number): string {
  const n = parseInt(hex.slice(1), 16);
  return `rgba(${(n >> 16) & 255}, ${(n >> 8) & 255}, ${n & 255}, ${alpha})`;
}
