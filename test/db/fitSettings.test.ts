import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { openDatabase } from "../../db/connection.ts";
import { listFits } from "../../db/fits.ts";
import { canonicalJson, stableHash } from "../../db/stableHash.ts";
import { FitOptions } from "../../server/analysis/fit/fitOptions.ts";
import { loadDemoData } from "../../server/services/demoData.ts";
import { fitSettingsOverview } from "../../server/services/fits/fitSettings.ts";

// An upgrade must keep every stored number traceable (common practice, no source): fits stored before
// fit settings existed are given the setting their options describe, by the same hash new fits use.
describe("fit settings on a database from before they existed", () => {
  it("fits stored without a setting (as migration 002 leaves older fits) get the setting of their options on first read, interpretation keys aside", async () => {
    const path = join(mkdtempSync(join(tmpdir(), "mg-fs-")), "old.db");
    const v1 = await openDatabase(path);
    expect(v1.migrated).toContain(2);
    loadDemoData(v1.db);
    const profiles = (v1.db.prepare("SELECT p.id FROM profiles p JOIN embryos e ON e.id = p.embryo_id WHERE e.genotype = 'wt' AND p.channel = 'glm' AND p.time_s IS NULL").all() as { id: number }[]).map((r) => r.id);
    const defaults = FitOptions.parse({ model: "exponential" });
    const windowed = FitOptions.parse({ model: "exponential", window: { xMinUm: 30 } });
    const insert = v1.db.prepare("INSERT INTO fits (profile_id, model, options_hash, options_json, engine_version, status, result_json, created_at) VALUES (?, 'exponential', ?, ?, 'old', 'converged', '{}', '2026-01-01T00:00:00Z')");
    for (const [i, id] of profiles.entries()) {
      // Half of them were fitted with a diffusion constant: that interprets a fit, it does not change it.
      const stored = { ...defaults, diffusion: i % 2 ? { valueUm2PerS: 1, seUm2PerS: null } : null, accumulationPositionsUm: [] };
      insert.run(id, stableHash(stored), canonicalJson(stored));
      insert.run(id, stableHash({ ...windowed, diffusion: null }), canonicalJson({ ...windowed, diffusion: null, accumulationPositionsUm: [] }));
    }
    v1.db.close();

    const upgraded = await openDatabase(path);
    expect(listFits(upgraded.db).every((f) => f.settingId === null)).toBe(true);
    const overview = fitSettingsOverview(upgraded.db, { channel: "glm" });
    expect(overview.settings.map((s) => s.name).sort()).toEqual(["exponential", "exponential-30um-on"]);
    for (const s of overview.settings) expect(s.coverage.find((c) => c.genotype === "wt")).toEqual({ genotype: "wt", fitted: profiles.length, profiles: profiles.length });
    expect(overview.settings.find((s) => s.name === "exponential")!.hash).toBe(stableHash(defaults));
    expect(listFits(upgraded.db).every((f) => f.settingId !== null)).toBe(true);
    upgraded.db.close();
  });
});
