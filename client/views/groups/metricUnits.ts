/** Names and units of the per-embryo quantities that groups are compared on. */
export const METRICS: Record<string, { name: string; unit: string }> = {
  lambda: { name: "decay length λ", unit: "µm" },
  amplitude: { name: "amplitude at the source", unit: "a.u." },
  boundary: { name: "boundary position", unit: "µm" },
  sigma_x: { name: "spread (σ_x or boundary SD)", unit: "µm" },
};
