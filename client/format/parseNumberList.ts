/**
 * Numbers typed as a list ("100, 150 200"): the numbers, and the parts that
 * are not numbers so the page can name them instead of dropping them.
 */
export function parseNumberList(text: string): { numbers: number[]; invalid: string[] } {
  const numbers: number[] = [];
  const invalid: string[] = [];
  for (const part of text.split(/[\s,;]+/)) {
    if (!part) continue;
    const n = Number(part);
    if (Number.isFinite(n)) numbers.push(n);
    else invalid.push(part);
  }
  return { numbers, invalid };
}
