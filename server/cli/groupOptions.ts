import type { OptionSpec } from "./command.ts";
import { numberOption } from "./cliNumbers.ts";
import { UserError } from "../userError.ts";

/** Options every group-statistics command shares: which embryos, which channel and fits. */
export const GROUP_OPTIONS: OptionSpec = {
  genotype: { type: "string" },
  channel: { type: "string" },
  fits: { type: "string" },
  "fit-model": { type: "string" },
  "fit-ids": { type: "string" },
  "include-excluded": { type: "boolean", default: false },
  threshold: { type: "string" },
  seed: { type: "string" },
};

export const GROUP_HELP = `  --genotype G[,G2…]    only these genotypes (e.g. the lines of a dosage series)
  --channel C           channel compared (default: the only stored one)
  --fits NAME           the fit setting every group's λ comes from (see "morphogauge fits settings";
                        a model name means that model's default fit). Default: the one setting that
                        covers every selected profile; with several candidates the command refuses
                        and lists them, because settings are never mixed. Profiles without a fit
                        under the setting are fitted now with it.
  --fit-model M         only settings of model M; "best": the model with the smallest AICc summed
                        over all groups, used for every group so they stay comparable
  --fit-ids ID,ID,…     exactly these stored fits (the fit_ids of a stored analysis): re-runs it
  --include-excluded    also use excluded embryos (left out and listed by default)
  --threshold V         boundary threshold in a.u. (default: a quarter of the way from the
                        reference embryos' far-end level to their source-end level)
  --seed N              seed of the resampling (default 1)`;

export function groupRequestFields(values: Record<string, unknown>) {
  return {
    selection: genotypeSelection(values.genotype as string | undefined),
    channel: values.channel as string | undefined,
    fits: values.fits as string | undefined,
    fitModel: values["fit-model"] as string | undefined,
    fitIds: idList("fit-ids", values["fit-ids"] as string | undefined),
    includeExcluded: values["include-excluded"] as boolean | undefined,
    threshold: numberOption("threshold", values.threshold as string | undefined),
    seed: numberOption("seed", values.seed as string | undefined),
  };
}

/** Option names of the group request fields, for messages about them. */
export const GROUP_FIELD_OPTIONS = { fitModel: "fit-model", fitIds: "fit-ids", includeExcluded: "include-excluded" };

/** "12,13,20" as a list of positive integer ids. */
function idList(name: string, value: string | undefined): number[] | undefined {
  if (value === undefined) return undefined;
  const ids = value.split(",").map((s) => s.trim()).filter(Boolean).map(Number);
  if (ids.length === 0 || ids.some((id) => !Number.isInteger(id) || id <= 0)) throw new UserError("bad-option", `--${name}: "${value}" is not a comma-separated list of ids`);
  return ids;
}

/** --genotype G or --genotype G1,G2,…: one genotype, or any of several. */
export function genotypeSelection(value: string | undefined): { genotype?: string; genotypes?: string[] } {
  if (value === undefined) return {};
  const list = value.split(",").map((g) => g.trim()).filter(Boolean);
  return list.length === 1 ? { genotype: list[0] } : { genotypes: list };
}
