import { mkdtempSync, readdirSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { openDatabaseSync } from "../../db/connection.ts";
import { currentExclusions, exclusionHistory } from "../../db/exclusions.ts";
import { runCliInProcess } from "../helpers/runCliInProcess.ts";

// Excluding an embryo removes exactly one replicate from every group analysis (common practice, no source:
// n counts the embryos an estimate is computed from); each run is a new process opening the database file,
// so what holds across runs holds across a restart.
describe("exclude and include on the command line", () => {
  const dir = mkdtempSync(join(tmpdir(), "mg-excl-"));
  const db = join(dir, "demo.db");
  const cli = async (...args: string[]) => {
    const r = await runCliInProcess([...args, "--db", db], {}, dir);
    if (r.code !== 0) throw new Error(`morphogauge ${args.join(" ")} exited ${r.code}: ${r.stderr}`);
    return r;
  };
  const json = async (...args: string[]) => JSON.parse((await cli(...args, "--json")).stdout);
  const compareN = async () => {
    const out = await json("compare", "--channel", "glm", "--genotype", "wt,tardy", "--permutations", "199", "--bootstrap", "200");
    return { n: Object.fromEntries(out.groups.map((g: { name: string; n: number }) => [g.name, g.n])), leftOut: out.left_out };
  };
  const precisionN = async () => {
    const out = await json("precision", "--channel", "glm", "--genotype", "wt", "--bootstrap", "100");
    return { n: out.n_embryos, leftOut: out.left_out };
  };
  const trackN = async () => {
    const out = await json("track", "--over", "length", "--channel", "glm", "--genotype", "wt");
    return { n: out.result.groups[0].n, leftOut: out.left_out };
  };

  beforeAll(async () => {
    await cli("demo");
  });

  it("excluding wt-03 lowers n by one in compare, precision and tracking, and each lists it with the reason", async () => {
    const before = { compare: await compareN(), precision: await precisionN(), track: await trackN() };
    expect(before.compare.n.wt).toBe(30);
    expect(before.compare.leftOut).toEqual([]);
    const text = await cli("exclude", "wt-03", "--reason", "out of focus");
    expect(text.stdout).toContain("Excluded: wt-03 (out of focus)");

    const after = { compare: await compareN(), precision: await precisionN(), track: await trackN() };
    expect(after.compare.n).toEqual({ wt: before.compare.n.wt - 1, tardy: before.compare.n.tardy });
    expect(after.precision.n).toBe(before.precision.n - 1);
    expect(after.track.n).toBe(before.track.n - 1);
    for (const r of [after.compare, after.precision, after.track]) expect(r.leftOut).toEqual([expect.objectContaining({ embryo: "wt-03", scope: "embryo", reason: "out of focus" })]);

    const listing = await cli("compare", "--channel", "glm", "--genotype", "wt,tardy", "--permutations", "199", "--bootstrap", "200");
    expect(listing.stdout).toContain("Left out (excluded): wt-03 (out of focus)");
    expect(listing.stdout).toMatch(/Fit setting: exponential \(exponential, whole profile, default options\)/);

    // The report shows the stored comparison's setting, fit ids and who was left out.
    const outDir = join(dir, "report");
    await cli("report", "--out", outDir, "--genotype", "wt,tardy", "--channel", "glm", "--fits", "exponential", "--bootstrap", "100");
    const html = readFileSync(join(outDir, readdirSync(outDir).find((f) => f.endsWith(".html"))!), "utf8");
    const stored = await json("compare", "--channel", "glm", "--genotype", "wt,tardy", "--permutations", "199", "--bootstrap", "200");
    expect(html).toContain("Fit setting <strong>exponential</strong>");
    expect(html).toContain(stored.fit_ids.slice(0, 5).join(", "));
    expect(html).toContain("Left out (excluded): wt-03 (out of focus).");
  });

  it("the exclusion is in the database file, and including the embryo again restores n and keeps the history", async () => {
    const file = openDatabaseSync(db);
    expect(currentExclusions(file).map((e) => [e.embryo, e.reason])).toEqual([["wt-03", "out of focus"]]);
    file.close();

    await cli("include", "wt-03", "--reason", "refocused stack");
    const back = await compareN();
    expect(back.n.wt).toBe(30);
    expect(back.leftOut).toEqual([]);
    expect((await precisionN()).leftOut).toEqual([]);
    const reopened = openDatabaseSync(db);
    expect(currentExclusions(reopened)).toEqual([]);
    expect(exclusionHistory(reopened).map((e) => [e.embryo, e.action, e.reason])).toEqual([
      ["wt-03", "exclude", "out of focus"],
      ["wt-03", "include", "refocused stack"],
    ]);
    reopened.close();
    expect((await cli("exclusions")).stdout).toContain("Nothing is excluded.");
  });

  it("a profile can be excluded on its own; unknown labels, channels and missing reasons are refused in plain words", async () => {
    await cli("exclude", "wt-05", "--channel", "glm", "--reason", "bleached");
    expect((await compareN()).leftOut).toEqual([expect.objectContaining({ embryo: "wt-05", scope: "profile", channel: "glm", reason: "bleached" })]);
    const noReason = await runCliInProcess(["exclude", "wt-06", "--db", db], {}, dir);
    expect(noReason.code).toBe(1);
    expect(noReason.stderr).toContain("--reason");
    const unknown = await runCliInProcess(["exclude", "wt-99", "--reason", "x", "--db", db], {}, dir);
    expect(unknown.code).toBe(1);
    expect(unknown.stderr).toContain('No embryo labelled "wt-99" is stored.');
    const channel = await runCliInProcess(["exclude", "wt-06", "--channel", "nope", "--reason", "x", "--db", db], {}, dir);
    expect(channel.stderr).toMatch(/has no profile of channel "nope" \(it has: glm/);
    const notExcluded = await runCliInProcess(["include", "wt-06", "--db", db], {}, dir);
    expect(notExcluded.code).toBe(1);
    expect(notExcluded.stderr).toContain("is not excluded");
    await cli("include", "wt-05");
  });

  it("fits settings lists each setting with its coverage per genotype, and fit reports the setting it used", async () => {
    const fitted = await cli("fit", "--genotype", "wt", "--channel", "glm", "--window", "30:", "--as", "posterior-window");
    expect(fitted.stdout).toContain("Fit setting posterior-window: exponential, window 30–end µm");
    const out = await json("fits", "settings", "--channel", "glm");
    const named = out.settings.find((s: { name: string }) => s.name === "posterior-window");
    expect(named.coverage.find((c: { genotype: string }) => c.genotype === "wt")).toEqual({ genotype: "wt", fitted: 30, profiles: 30 });
    const text = await cli("fits", "settings", "--channel", "glm");
    expect(text.stdout).toMatch(/posterior-window\s+exponential, window 30–end µm\s+.*wt 30\/30/);
    // wt and tardy: only the default setting covers both, so it is used; wt alone: two settings cover it,
    // so a plan without --fits is refused, and naming one works.
    const covering = await json("compare", "--channel", "glm", "--genotype", "wt,tardy", "--permutations", "199", "--bootstrap", "200");
    expect(covering.fit_setting.name).toBe("exponential");
    const wtOnly = await runCliInProcess(["plan", "--effect", "0.2", "--channel", "glm", "--genotype", "wt", "--db", db], {}, dir);
    expect(wtOnly.code).toBe(1);
    expect(wtOnly.stderr).toContain("choose one with --fits NAME");
    const chosen = await json("plan", "--effect", "0.2", "--channel", "glm", "--genotype", "wt", "--fits", "posterior-window");
    expect(chosen.fit_setting.name).toBe("posterior-window");
  });
});
