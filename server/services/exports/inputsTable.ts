import { getAnalysis } from "../../../db/analyses.ts";
import type { Db } from "../../../db/connection.ts";
import { listProfiles } from "../../../db/profiles.ts";
import { UserError } from "../../userError.ts";
import type { LeftOut } from "../exclusions/exclusionService.ts";
import type { AnalysisInputs } from "../groups/analysisInputs.ts";
import type { CsvTable } from "./csvText.ts";

/**
 * The inputs of a stored analysis, one row per profile: the profiles it used
 * (with the fit of each and the fit setting, for comparisons, tracking and
 * plans) and the embryos or profiles an exclusion left out, with the reason.
 */
export function inputsTable(db: Db, id: number): CsvTable {
  const a = getAnalysis(db, id);
  if (!a) throw new UserError("unknown-analysis", `No analysis with id ${id}.`, { status: 404 });
  const result = a.result as { inputs?: AnalysisInputs; left_out?: LeftOut[] };
  const inputs = result.inputs;
  const profileIds = inputs?.profile_ids ?? a.profileIds;
  const fitOf = new Map(inputs ? inputs.profile_ids.map((p, i) => [p, inputs.fit_ids[i]]) : []);
  const profiles = new Map(listProfiles(db, { profileIds }).map((p) => [p.profileId, p]));
  const used = profileIds.map((pid) => {
    const p = profiles.get(pid);
    return ["used", p?.embryo ?? null, p?.genotype ?? null, p?.channel ?? null, pid, fitOf.get(pid) ?? null, inputs?.fit_setting.name ?? null, inputs?.fit_setting.hash ?? null, null];
  });
  const leftOut = (inputs?.left_out ?? result.left_out ?? []).map((l) => ["left out", l.embryo, l.genotype, l.scope === "profile" ? l.channel : "all", null, null, null, null, l.reason]);
  return {
    columns: ["role", "embryo", "genotype", "channel", "profile_id", "fit_id", "fit_setting", "fit_setting_hash", "reason"],
    rows: [...used, ...leftOut],
  };
}
