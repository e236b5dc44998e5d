/** A warning about the data or the analysis: what happened and how to fix or silence it. */
export interface AnalysisWarning {
  /** Stable identifier, e.g. "embryos-flipped". */
  code: string;
  message: string;
  /** How to fix or silence it. */
  fix: string;
}

/** Collects warnings, de-duplicating identical ones and counting repeats. */
export class WarningList {
  private readonly items = new Map<string, AnalysisWarning & { count: number }>();

  add(code: string, message: string, fix: string): void {
    const key = `${code}\u0000${message}`;
    const hit = this.items.get(key);
    if (hit) hit.count += 1;
    else this.items.set(key, { code, message, fix, count: 1 });
  }

  addAll(warnings: readonly AnalysisWarning[]): void {
    for (const w of warnings) this.add(w.code, w.message, w.fix);
  }

  list(): (AnalysisWarning & { count: number })[] {
    return [...this.items.values()].map((w) => ({ ...w }));
  }
}
