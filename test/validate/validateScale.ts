/**
 * Shared sizing for the slow seeded simulations under test/validate/ (`npm run validate`).
 * MORPHOGAUGE_VALIDATE_SCALE (default 1) scales every replicate count down for a bounded run
 * (`.ci/run` uses 0.2); tolerances then widen with the binomial SE, so a bounded run is as
 * strict as its size allows and never stricter.
 */
export function validateScale(): number {
  const raw = process.env.MORPHOGAUGE_VALIDATE_SCALE;
  if (raw === undefined || raw === "") return 1;
  const s = Number(raw);
  if (!(s > 0 && s <= 1)) throw new Error(`MORPHOGAUGE_VALIDATE_SCALE must be in (0, 1], got "${raw}"`);
  return s;
}

/** Replicates to run: the full count times the scale, never fewer than `minimum`. */
export function scaledReplicates(full: number, minimum = 200): number {
  return Math.max(minimum, Math.round(full * validateScale()));
}

/**
 * Acceptance band for a coverage estimated from `replicates` seeded experiments:
 * the target band [nominal − width, nominal + width], widened to ±3 binomial SEs
 * √(p(1 − p)/R) when R is too small for the target band to be fair (a true 95%
 * coverage then fails by chance in about 0.3% of seeds). Common practice, no source.
 */
export function coverageBand(replicates: number, nominal = 0.95, width = 0.02): [number, number] {
  const half = Math.max(width, 3 * Math.sqrt((nominal * (1 - nominal)) / replicates));
  return [nominal - half, nominal + half];
}
