import type { ImportChange } from "../../../db/importChanges.ts";
import type { ImportToStore } from "../../../db/storeImport.ts";
import type { ImportWarning, ParsedImport } from "../../import/records.ts";
import { UserError, type UserIssue } from "../../userError.ts";
import { describeProfile, type FieldDifference, type ImportPlan } from "./planImport.ts";

/**
 * What to do with values a file gives differently from the stored embryo:
 * refuse the file (the default), keep the stored values, or take the file's
 * (recorded with the import, so deleting it puts the stored ones back).
 * Importing the embryos as new ones under a label prefix is the label-prefix option.
 */
export type ConflictChoice = "refuse" | "keep" | "replace";
export const CONFLICT_CHOICES = ["refuse", "keep", "replace"] as const;

export type ResolvedImport =
  | { kind: "store"; toStore: ImportToStore; notes: string[] }
  | { kind: "nothing-new"; message: string };

/** Turn a plan and the user's choice into what to store, or refuse with every conflict listed. */
export function resolveImport(parsed: ParsedImport, plan: ImportPlan, choice: ConflictChoice, settings: Record<string, unknown>): ResolvedImport {
  const file = parsed.fileName;
  if (plan.sameImport) {
    return { kind: "nothing-new", message: `already imported as ${plan.sameImport.fileName} (import #${plan.sameImport.importId}) with the same options and side file; nothing added` };
  }
  const conflicts = conflictIssues(plan, file);
  if (conflicts.length > 0 && choice === "refuse") {
    throw new UserError(
      "import-conflicts",
      `${conflicts[0].path}: ${conflicts[0].message}${conflicts.length > 1 ? ` (and ${conflicts.length - 1} more conflict${conflicts.length > 2 ? "s" : ""})` : ""}. ` +
        `Choose what to do: --on-conflict keep (keep the stored values), --on-conflict replace (take this file's values; deleting the import puts the stored ones back), or --label-prefix (import them as new embryos). Nothing was imported.`,
      { status: 409, issues: conflicts },
    );
  }
  const clashes = plan.stored.flatMap((s) => s.clashingProfiles.map((c) => ({ label: s.label, ...c })));
  if (clashes.length > 0 && choice === "replace") {
    const c = clashes[0];
    throw new UserError(
      "profile-exists",
      `${file}: embryo "${c.label}" already has a stored profile for channel "${c.profile}" (from ${c.storedFrom}) with other values${clashes.length > 1 ? ` (and ${clashes.length - 1} more)` : ""}; an import never replaces a stored profile. Delete that import first, or import under another channel name (--channel) or label prefix (--label-prefix). Nothing was imported.`,
      { status: 409, issues: clashes.map((x) => ({ path: `${file}, embryo "${x.label}"`, message: `profile "${x.profile}" already stored from ${x.storedFrom} with other values` })) },
    );
  }

  const warnings: ImportWarning[] = [...parsed.warnings];
  const notes: string[] = [];
  const changes: ImportChange[] = [];
  for (const s of plan.stored) {
    for (const a of s.additions) changes.push({ embryoId: s.embryoId, field: a.field, oldValue: a.stored, newValue: a.file, kind: "filled" });
    if (choice === "replace") for (const c of s.conflicts) changes.push({ embryoId: s.embryoId, field: c.field, oldValue: c.stored, newValue: c.file, kind: "replaced" });
  }
  if (plan.additions > 0) notes.push(`filled in ${summarise(plan.stored.flatMap((s) => s.additions))} that stored embryos lacked`);
  if (choice === "replace" && plan.conflicts > 0) notes.push(`replaced ${summarise(plan.stored.flatMap((s) => s.conflicts))} with this file's values (deleting this import puts the stored ones back)`);
  const kept = plan.stored.flatMap((s) => s.conflicts.map((c) => ({ label: s.label, ...c })));
  if (choice === "keep" && kept.length > 0) {
    warnings.push({
      code: "kept-stored-values",
      message: `${kept.length} value${kept.length > 1 ? "s" : ""} of this file differ${kept.length > 1 ? "" : "s"} from the stored embryos and ${kept.length > 1 ? "were" : "was"} not applied: ${kept.slice(0, 5).map((k) => `embryo "${k.label}" ${k.name} ${show(k.file)} (kept ${show(k.stored)})`).join("; ")}${kept.length > 5 ? "; …" : ""}`,
      hint: "to take this file's values, delete this import and import it again with --on-conflict replace",
      embryos: [...new Set(kept.map((k) => k.label))],
    });
  }
  if (choice === "keep" && clashes.length > 0) {
    warnings.push({
      code: "profiles-not-added",
      message: `${clashes.length} profile${clashes.length > 1 ? "s" : ""} of this file ${clashes.length > 1 ? "were" : "was"} not added: the embryo already has one for the same channel with other values (${clashes.slice(0, 5).map((c) => `"${c.label}" ${c.profile}`).join(", ")}${clashes.length > 5 ? ", …" : ""})`,
      hint: "import them under another channel name (--channel) or a label prefix (--label-prefix)",
      embryos: [...new Set(clashes.map((c) => c.label))],
    });
  }

  const skip = new Set(plan.stored.flatMap((s) => [...s.unchangedProfiles, ...s.clashingProfiles.map((c) => c.profile)].map((p) => `${s.label}\u0000${p}`)));
  const profiles = parsed.profiles.filter((p) => !skip.has(`${p.embryo}\u0000${describeProfile(p.channel, p.timeS)}`));
  const newLabels = new Set(plan.newEmbryos);
  if (profiles.length === 0 && changes.length === 0 && newLabels.size === 0) {
    const earlier = plan.earlierImports.map((i) => `import #${i.importId} of ${i.fileName}: ${i.differences.join("; ")}`).join(" / ");
    return {
      kind: "nothing-new",
      message:
        `nothing added: every profile of this file is already stored unchanged and the stored embryos already hold its values` +
        (kept.length + clashes.length > 0 ? ` or kept their own (${kept.length + clashes.length} differences kept as stored)` : "") +
        (earlier ? `; these bytes were imported before with other options (${earlier})` : ""),
    };
  }
  if (plan.unchangedProfiles > 0) notes.push(`${plan.unchangedProfiles} profile${plan.unchangedProfiles > 1 ? "s were" : " was"} already stored unchanged and not added again`);
  for (const i of plan.earlierImports) notes.push(`these bytes were imported before as #${i.importId} (${i.fileName}); this is a new import because ${i.differences.join("; ")}`);
  return {
    kind: "store",
    notes,
    toStore: {
      parsed,
      settings: { ...settings, onConflict: choice },
      warnings,
      newEmbryos: parsed.embryos.filter((e) => newLabels.has(e.label)),
      storedEmbryoIds: new Map(plan.stored.map((s) => [s.label, s.embryoId])),
      changes,
      profiles,
    },
  };
}

/** Every conflict as an issue: a differing value or a profile stored with other values. */
export function conflictIssues(plan: ImportPlan, file: string): UserIssue[] {
  return plan.stored.flatMap((s) => [
    ...s.conflicts.map((c) => ({ path: file, message: `embryo "${s.label}" is already stored with ${c.name} ${show(c.stored)} (from ${s.storedFrom}), but this file gives ${show(c.file)}` })),
    ...s.clashingProfiles.map((c) => ({ path: file, message: `embryo "${s.label}" already has a stored profile for channel "${c.profile}" (from ${c.storedFrom}) with other values` })),
  ]);
}

/** "the genotype of 20 embryos and the length (µm) of 3". */
function summarise(diffs: FieldDifference[]): string {
  const byName = new Map<string, number>();
  for (const d of diffs) byName.set(d.name, (byName.get(d.name) ?? 0) + 1);
  return [...byName].map(([name, n]) => `the ${name} of ${n} embryo${n > 1 ? "s" : ""}`).join(", ");
}

function show(v: unknown): string {
  return typeof v === "string" ? `"${v}"` : v === null ? "(none)" : String(v);
}
