/** A number as the page prints it (typographic minus allowed) with half a unit of its last digit, the rounding it may carry. */
export function readNumber(text: string): { value: number; halfUnit: number } {
  const t = text.trim().replace("\u2212", "-");
  const decimals = t.includes(".") ? t.split(".")[1].length : 0;
  return { value: Number(t), halfUnit: 0.5 * 10 ** -decimals };
}

/** All numbers in a text such as "89.5 ± 1.0" or "[87.4, 91.5]", in order. */
export function readNumbers(text: string): { value: number; halfUnit: number }[] {
  return (text.replace(/\u2212/g, "-").match(/-?\d+(?:\.\d+)?/g) ?? []).map(readNumber);
}
