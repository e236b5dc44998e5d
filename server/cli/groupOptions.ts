import type { OptionSpec } from "./command.ts";
import { numberOption } from "./cliNumbers.ts";

/** Options every group-statistics command shares: which embryos, which channel and fits. */
export const GROUP_OPTIONS: OptionSpec = {
  genotype: { type: "string" },
  channel: { type: "string" },
  "fit-model": { type: "string" },
  threshold: { type: "string" },
  seed: { type: "string" },
};

export const GROUP_HELP = `  --genotype G[,G2…]    only these genotypes (e.g. the lines of a dosage series)
  --channel C           channel compared (default: the only stored one)
  --fit-model M         model whose fitted λ is used (default exponential; the newest fit of
                        each profile; profiles without one are fitted now with default options)
  --threshold V         boundary threshold in a.u. (default: a quarter of the way from the
                        reference embryos' far-end level to their source-end level)
  --seed N              seed of the resampling (default 1)`;

export function groupRequestFields(values: Record<string, unknown>) {
  return {
    selection: genotypeSelection(values.genotype as string | undefined),
    channel: values.channel as string | undefined,
    fitModel: values["fit-model"] as string | undefined,
    threshold: numberOption("threshold", values.threshold as string | undefined),
    seed: numberOption("seed", values.seed as string | undefined),
  };
}

/** --genotype G or --genotype G1,G2,…: one genotype, or any of several. */
export function genotypeSelection(value: string | undefined): { genotype?: string; genotypes?: string[] } {
  if (value === undefined) return {};
  const list = value.split(",").map((g) => g.trim()).filter(Boolean);
  return list.length === 1 ? { genotype: list[0] } : { genotypes: list };
}
