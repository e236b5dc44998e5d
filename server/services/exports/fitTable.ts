import type { Db } from "../../../db/connection.ts";
import { listFitItems, type FitListFilter, type FitListItem } from "../../../db/fits.ts";
import type { CsvTable } from "./csvText.ts";

/** The decay-length table of stored fits (newest per profile and model): λ with SE and 95% CI, fit quality and settings. */
export function fitTable(db: Db, filter: FitListFilter = {}): CsvTable {
  return fitRowsTable(listFitItems(db, filter));
}

/** The decay-length table of the given fit rows. */
export function fitRowsTable(fits: readonly FitListItem[]): CsvTable {
  return {
    columns: [
      "fit_id", "profile_id", "embryo", "genotype", "channel", "time_s", "model", "status",
      "lambda_um", "lambda_se_um", "lambda_ci95_low_um", "lambda_ci95_high_um", "amplitude_au", "background_au",
      "r2", "aicc", "n_points", "window_min_um", "window_max_um", "engine_version", "message",
    ],
    rows: fits.map((f) => [
      f.fitId, f.profileId, f.embryo, f.genotype, f.channel, f.timeS, f.model, f.status,
      f.lambdaUm?.value, f.lambdaUm?.se, f.lambdaUm?.ci95?.[0], f.lambdaUm?.ci95?.[1], f.amplitude?.value, f.background?.value,
      f.r2, f.aicc, f.nPoints, f.window?.xMinUm, f.window?.xMaxUm, f.engineVersion, f.message,
    ]),
  };
}
