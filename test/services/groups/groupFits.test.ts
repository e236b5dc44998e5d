import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { openDatabaseSync, type Db } from "../../../db/connection.ts";
import { listFits } from "../../../db/fits.ts";
import { loadDemoData } from "../../../server/services/demoData.ts";
import { FitRequest } from "../../../server/services/fits/fitRequest.ts";
import { prepareFitInput, storeFitOutput } from "../../../server/services/fits/fitService.ts";
import { fitSettingsOverview } from "../../../server/services/fits/fitSettings.ts";
import { runFitTask } from "../../../server/services/fits/fitTask.ts";
import { CompareRequest } from "../../../server/services/groups/compareRequest.ts";
import { prepareComparison, storeComparison } from "../../../server/services/groups/compareService.ts";
import { runCompareTask } from "../../../server/services/groups/compareTask.ts";
import { isUserError, type UserError } from "../../../server/userError.ts";
import { inputsTable } from "../../../server/services/exports/inputsTable.ts";

function fit(db: Db, request: object) {
  const input = prepareFitInput(db, FitRequest.parse(request));
  return storeFitOutput(db, input, runFitTask(input));
}

function compare(db: Db, request: object) {
  const prepared = prepareComparison(db, CompareRequest.parse({ channel: "glm", permutations: 199, bootstrap: 200, ...request }));
  return storeComparison(db, prepared, runCompareTask(prepared.task));
}

function refusal(f: () => unknown): UserError {
  try {
    f();
  } catch (e) {
    if (isUserError(e)) return e;
    throw e;
  }
  throw new Error("expected a refusal");
}

const GENOTYPES = ["wt", "tardy", "glm-2x"];

function demoDb(): Db {
  const db = openDatabaseSync(join(mkdtempSync(join(tmpdir(), "mg-settings-")), "demo.db"));
  loadDemoData(db);
  return db;
}

// Group analyses never mix fit settings (common practice, no source: values compared across groups must
// come from one estimator, or a difference between groups can be a difference between fitting choices).
describe("fit settings in group analyses", () => {
  it("a comparison refuses when genotypes were fitted under different windows, listing the settings and their coverage", () => {
    const db = demoDb();
    fit(db, { selection: { genotype: "wt", channel: "glm" } });
    const named = fit(db, { selection: { genotypes: ["tardy", "glm-2x"], channel: "glm" }, options: { window: { xMinUm: 30 } }, as: "posterior-window" });
    expect(named.settings.map((s) => s.name)).toEqual(["posterior-window"]);
    expect(named.fits.every((f) => f.setting === "posterior-window")).toBe(true);
    const e = refusal(() => compare(db, { selection: { genotypes: GENOTYPES } }));
    expect(e.code).toBe("choose-fit-setting");
    expect(e.message).toContain("never mix");
    expect(e.message).toMatch(/posterior-window \(exponential, window 30–end µm\): glm-2x 30\/30, tardy 30\/30, wt 0\/30/);
    expect(e.message).toMatch(/exponential \(exponential, whole profile, default options\): glm-2x 0\/30, tardy 0\/30, wt 30\/30/);

    // Choosing the setting fits wt now with that window, never with the defaults.
    const c = compare(db, { selection: { genotypes: GENOTYPES }, fits: "posterior-window" });
    expect(c.fit_setting?.name).toBe("posterior-window");
    expect(c.fitted_now).toBe(30);
    const used = listFits(db, { ids: c.fit_ids! });
    expect(used).toHaveLength(90);
    for (const f of used) expect((f.options as { window?: { xMinUm?: number } }).window?.xMinUm).toBe(30);
    expect(new Set(used.map((f) => f.settingId)).size).toBe(1);
    db.close();
  });

  it("uses the one setting that covers every selected profile when another covers only some", () => {
    const db = demoDb();
    fit(db, { selection: { genotypes: GENOTYPES, channel: "glm" } });
    fit(db, { selection: { genotype: "wt", channel: "glm" }, options: { window: { xMinUm: 30 } } });
    const c = compare(db, { selection: { genotypes: GENOTYPES } });
    expect(c.fit_setting?.name).toBe("exponential");
    expect(c.fit_setting_chosen).toContain("covering every selected profile");
    expect(c.fitted_now).toBe(0);
    const used = listFits(db, { ids: c.fit_ids! });
    for (const f of used) expect((f.options as { window?: unknown }).window).toBeUndefined();
    const overview = fitSettingsOverview(db, { channel: "glm" });
    const windowed = overview.settings.find((s) => s.name === "exponential-30um-on")!;
    expect(windowed.coverage.find((g) => g.genotype === "wt")).toEqual({ genotype: "wt", fitted: 30, profiles: 30 });
    expect(windowed.coverage.find((g) => g.genotype === "tardy")?.fitted).toBe(0);
    db.close();
  });

  it("a stored comparison lists its fit ids and setting, and re-running from those ids reproduces it exactly", () => {
    const db = demoDb();
    fit(db, { selection: { genotypes: GENOTYPES, channel: "glm" }, options: { window: { xMinUm: 30 } }, as: "posterior-window" });
    const first = compare(db, { selection: { genotypes: GENOTYPES }, reference: "wt" });
    expect(first.fit_ids).toHaveLength(90);
    expect(first.profile_ids).toHaveLength(90);
    // Later fits of the same profiles under another setting must not change a re-run from the ids.
    fit(db, { selection: { genotypes: GENOTYPES, channel: "glm" }, models: ["finite"] });
    const again = compare(db, { fitIds: first.fit_ids!, reference: "wt" });
    expect(again.fit_setting).toEqual(first.fit_setting);
    expect(again.fit_ids).toEqual(first.fit_ids);
    expect(again.groups).toEqual(first.groups);
    expect(again.contrasts).toEqual(first.contrasts);
    expect(again.embryo_values).toEqual(first.embryo_values);

    // inputs.csv lists one row per profile used, with its fit id and the setting.
    const table = inputsTable(db, first.analysis_id);
    const used = table.rows.filter((r) => r[0] === "used");
    expect(used.map((r) => r[table.columns.indexOf("fit_id")])).toEqual(first.fit_ids);
    expect(new Set(used.map((r) => r[table.columns.indexOf("fit_setting")]))).toEqual(new Set(["posterior-window"]));
    db.close();
  });

  it("fit --as refuses a name already used for other options", () => {
    const db = demoDb();
    fit(db, { selection: { genotype: "wt", channel: "glm" }, options: { window: { xMinUm: 30 } }, as: "posterior-window" });
    const e = refusal(() => fit(db, { selection: { genotype: "wt", channel: "glm" }, options: { window: { xMinUm: 40 } }, as: "posterior-window" }));
    expect(e.code).toBe("setting-name-taken");
    expect(e.message).toContain("window 30–end µm");
    db.close();
  });
});

// Source: fixtures/demoScenario.ts — the demo profiles are generated with the steady state of a localized
// source in a finite domain with a no-flux far end (the "source" model; "finite" is its point-source limit),
// so AICc should prefer one of those two over the exponential for most embryos of each genotype.
describe("model awareness in group analyses", () => {
  it("warns when AICc prefers the finite model for most profiles of a group, and --fit-model best picks one model for every group", () => {
    const db = demoDb();
    const plain = compare(db, { selection: { genotypes: ["wt", "tardy"] } });
    expect(plain.fit_setting?.model).toBe("exponential");
    const tardy = plain.model_preference!.groups.find((g) => g.group === "tardy")!;
    expect(["finite", "source"]).toContain(tardy.preferred);
    expect(tardy.weight_share[tardy.preferred!]).toBeGreaterThan(0.5);
    expect(tardy.weight_share.exponential).toBeLessThan(0.5);
    expect(plain.model_preference!.warnings.some((w) => w.includes(`prefers the ${tardy.preferred} model for most profiles of`) && w.includes("tardy ("))).toBe(true);

    const best = compare(db, { selection: { genotypes: ["wt", "tardy"] }, fitModel: "best" });
    expect(best.fit_setting?.model).toBe(best.model_preference!.best_overall);
    expect(["finite", "source"]).toContain(best.fit_setting?.model);
    const summed = (m: string) => best.model_preference!.groups.reduce((s, g) => s + g.summed_aicc[m], 0);
    for (const m of Object.keys(best.model_preference!.groups[0].summed_aicc)) expect(summed(best.fit_setting!.model)).toBeLessThanOrEqual(summed(m));
    db.close();
  });
});
