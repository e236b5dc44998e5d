import type { Db } from "../../db/connection.ts";
import { changedProfiles, profileIdentities, type ProfileIdentity } from "../../db/profileFingerprints.ts";
import { UserError } from "../userError.ts";

const list = (ids: number[]) => (ids.length <= 8 ? ids.join(", ") : `${ids.slice(0, 8).join(", ")} and ${ids.length - 8} more`);

/** Refuse to store a result when any profile it was computed from was deleted or changed since. */
export function assertInputsUnchanged(db: Db, inputs: readonly ProfileIdentity[]): void {
  const { deleted, changed } = changedProfiles(db, inputs);
  if (deleted.length === 0 && changed.length === 0) return;
  const parts = [
    deleted.length > 0 ? `${deleted.length} were deleted (profile id ${list(deleted)})` : "",
    changed.length > 0 ? `${changed.length} changed (profile id ${list(changed)})` : "",
  ].filter(Boolean);
  throw new UserError(
    "inputs-changed",
    `Nothing was stored: of the ${inputs.length} profiles this analysis was computed from, ${parts.join(" and ")} while it waited or ran, so its numbers no longer belong to the stored embryos. Run it again on the data as stored now.`,
    { status: 409 },
  );
}

/**
 * Tie a job's result to the profiles it reads: record their identities (id
 * and content hash) now, and store the result only if, in the same
 * transaction, they are all still there and unchanged.
 */
export function bindToInputs<O, R>(db: Db, profileIds: readonly number[], store: (output: O) => R): { inputs: ProfileIdentity[]; finish: (output: O) => R } {
  const inputs = profileIdentities(db, profileIds);
  return {
    inputs,
    finish: (output: O) =>
      db.transaction(() => {
        assertInputsUnchanged(db, inputs);
        return store(output);
      })(),
  };
}
