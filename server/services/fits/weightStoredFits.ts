import type { FitListItem } from "../../../db/fits.ts";
import { akaikeWeights } from "../../analysis/fit/akaikeWeights.ts";

/**
 * Akaike weights across the models stored for each profile, counting only fits
 * over the same points (the window actually fitted) (AICc compares models on the same data). A fit alone in
 * its profile-and-window gets no weight.
 */
export function weightStoredFits(items: FitListItem[]): (FitListItem & { akaikeWeight: number | null })[] {
  const groups = new Map<string, FitListItem[]>();
  for (const f of items) {
    // The points actually fitted when recorded (a detected source plateau moves the start), else the requested window.
    const points = f.fittedWindow ? [f.fittedWindow.fromUm, f.fittedWindow.toUm] : (f.window ?? {});
    const key = `${f.profileId}|${JSON.stringify(points)}`;
    groups.set(key, [...(groups.get(key) ?? []), f]);
  }
  const weight = new Map<number, number>();
  for (const fits of groups.values()) {
    const candidates = fits.filter((f) => f.aicc !== null).map((f) => ({ model: String(f.fitId), aicc: f.aicc as number }));
    if (candidates.length < 2) continue;
    for (const r of akaikeWeights(candidates).ranking) weight.set(Number(r.model), r.weight);
  }
  return items.map((f) => ({ ...f, akaikeWeight: weight.get(f.fitId) ?? null }));
}
