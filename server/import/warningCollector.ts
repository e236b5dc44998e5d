import type { ImportWarning } from "./records.ts";

/**
 * Warnings are counted and de-duplicated: one entry per kind of problem,
 * listing the embryos it concerns, with a hint on how to fix or silence it.
 */
export class WarningCollector {
  private readonly byCode = new Map<string, ImportWarning>();

  /** Record a warning about `embryo` (or the whole file when embryo is null). */
  add(code: string, embryo: string | null, message: (embryos: string[]) => string, hint: string): void {
    let w = this.byCode.get(code);
    if (!w) {
      w = { code, message: "", hint, embryos: [] };
      this.byCode.set(code, w);
    }
    if (embryo !== null && !w.embryos.includes(embryo)) w.embryos.push(embryo);
    w.message = message(w.embryos);
  }

  list(): ImportWarning[] {
    return [...this.byCode.values()];
  }
}

/** "E1, E2 and 3 more" for messages. */
export function listEmbryos(embryos: string[], shown = 5): string {
  const quoted = embryos.map((e) => `"${e}"`);
  if (quoted.length <= shown) return quoted.join(", ");
  return `${quoted.slice(0, shown).join(", ")} and ${quoted.length - shown} more`;
}
