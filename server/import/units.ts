import type { PositionUnit } from "./records.ts";

/** A length unit read from a header: the stored unit and the factor to it (mm → µm is 1000). */
export interface LengthUnit {
  unit: PositionUnit;
  factor: number;
}

const LENGTH_UNITS: Record<string, LengthUnit> = {
  "µm": { unit: "um", factor: 1 },
  "μm": { unit: "um", factor: 1 },
  um: { unit: "um", factor: 1 },
  micron: { unit: "um", factor: 1 },
  microns: { unit: "um", factor: 1 },
  micrometer: { unit: "um", factor: 1 },
  micrometers: { unit: "um", factor: 1 },
  micrometre: { unit: "um", factor: 1 },
  micrometres: { unit: "um", factor: 1 },
  mm: { unit: "um", factor: 1000 },
  nm: { unit: "um", factor: 0.001 },
  px: { unit: "px", factor: 1 },
  pix: { unit: "px", factor: 1 },
  pixel: { unit: "px", factor: 1 },
  pixels: { unit: "px", factor: 1 },
  "x/l": { unit: "fraction", factor: 1 },
  fraction: { unit: "fraction", factor: 1 },
  frac: { unit: "fraction", factor: 1 },
  relative: { unit: "fraction", factor: 1 },
  rel: { unit: "fraction", factor: 1 },
  "%": { unit: "fraction", factor: 0.01 },
  percent: { unit: "fraction", factor: 0.01 },
  "% el": { unit: "fraction", factor: 0.01 },
  "%el": { unit: "fraction", factor: 0.01 },
};

const TIME_UNITS: Record<string, number> = {
  s: 1, sec: 1, secs: 1, second: 1, seconds: 1,
  min: 60, mins: 60, minute: 60, minutes: 60, m: 60,
  h: 3600, hr: 3600, hrs: 3600, hour: 3600, hours: 3600, hpf: 3600, hph: 3600,
};

export function lengthUnit(text: string): LengthUnit | null {
  return LENGTH_UNITS[text.trim().toLowerCase()] ?? null;
}

/** Seconds per unit, or null if the text is not a time unit. */
export function timeUnitSeconds(text: string): number | null {
  return TIME_UNITS[text.trim().toLowerCase()] ?? null;
}

export const KNOWN_LENGTH_UNITS = "µm, mm, nm, px (with a pixel size) or a fraction of length (x/L, %)";
export const KNOWN_TIME_UNITS = "s, min or h";
