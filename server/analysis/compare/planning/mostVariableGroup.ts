import { mean, standardDeviation } from "../../stats/descriptive.ts";

/** One candidate group's variability. */
export interface GroupVariability {
  group: string;
  n: number;
  /** Embryo-to-embryo CV, SD/mean. */
  cv: number;
}

/** Which group's variability a plan uses, and the others it was chosen from. */
export interface PlanningGroupChoice {
  group: string;
  n: number;
  cv: number;
  /** 'chosen': named by the user; 'most_variable': the default, the largest CV of the candidates. */
  rule: "chosen" | "most_variable";
  /** Every candidate group with at least `minimum` values, most variable first. */
  candidates: GroupVariability[];
  /** One sentence saying which group was used and why, for the plan's notes. */
  sentence: string;
}

/**
 * The group whose embryo-to-embryo variability a sample-size plan uses. By
 * default the most variable of the candidate groups (largest CV), because the
 * group that will be hardest to measure decides how many embryos are enough:
 * planning on a calm group under-powers the study. Groups with fewer than
 * `minimum` values are not candidates. Common practice, no source.
 */
export function mostVariableGroup(values: ReadonlyMap<string, readonly number[]>, chosen?: string, minimum = 3): PlanningGroupChoice | null {
  const candidates: GroupVariability[] = [];
  for (const [group, v] of values) {
    const x = v.filter(Number.isFinite);
    const m = x.length >= 2 ? mean(x) : NaN;
    if (x.length >= minimum && m > 0) candidates.push({ group, n: x.length, cv: standardDeviation(x) / m });
  }
  candidates.sort((a, b) => b.cv - a.cv || a.group.localeCompare(b.group));
  const pct = (cv: number) => `${(cv * 100).toFixed(1)}%`;
  const others = (g: string) => candidates.filter((c) => c.group !== g).map((c) => `${c.group} ${pct(c.cv)}`).join(", ");
  if (chosen !== undefined) {
    const c = candidates.find((k) => k.group === chosen);
    if (!c) return null;
    const rest = others(chosen);
    return { ...c, rule: "chosen", candidates, sentence: `variability from "${chosen}" (CV ${pct(c.cv)}, ${c.n} embryos), as chosen${rest ? `; other groups: ${rest}` : ""}` };
  }
  const top = candidates[0];
  if (!top) return null;
  const rest = others(top.group);
  return {
    ...top, rule: "most_variable", candidates,
    sentence: `variability from "${top.group}" (CV ${pct(top.cv)}, ${top.n} embryos), the most variable of the selected groups${rest ? ` (${rest})` : ""}, so the plan is conservative`,
  };
}
