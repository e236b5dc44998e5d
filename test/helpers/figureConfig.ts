import type { FigureConfig } from "../../client/figures/scatterConfig.ts";

/** The dataset whose label starts with `text` (fails loudly when there is none). */
export function dataset(config: FigureConfig, text: string) {
  const d = config.data.datasets.find((s) => (s.label ?? "").startsWith(text));
  if (!d) throw new Error(`no dataset labelled "${text}…"; labels: ${config.data.datasets.map((s) => JSON.stringify(s.label)).join(", ")}`);
  return d;
}

/** The titles of the x and y axes. */
export function axisTitles(config: FigureConfig): string[] {
  const scales = (config.options?.scales ?? {}) as Record<string, { title?: { text?: string } }>;
  return Object.values(scales).map((s) => s.title?.text ?? "");
}

/** The figure's title text. */
export function titleOf(config: FigureConfig): string {
  return String(config.options?.plugins?.title?.text ?? "");
}
