import { formatSignificant } from "./significant.ts";

/** Smallest p-value printed as a number; below it "< 0.001". */
const SMALLEST_SHOWN = 0.001;

/**
 * A p-value as readers expect it: two significant figures, "< 0.001" below
 * that, "—" when the test was not run.
 */
export function formatPValue(p: number | null | undefined): string {
  if (p === null || p === undefined || !Number.isFinite(p)) return "\u2014";
  if (p < SMALLEST_SHOWN) return "< 0.001";
  if (p >= 1) return "1";
  return formatSignificant(p, 2);
}
