import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startBrowserSession, type BrowserSession } from "../helpers/browserSession.ts";

interface JobList {
  jobs: { kind: string; status: string; result: { results: { analysis_id: number; group: string; n_embryos: number; left_out: { embryo: string; reason: string }[]; outliers: { flagged: { embryo: string }[] } }[] } | null }[];
}

const lastPrecision = async (s: BrowserSession) => (await s.api<JobList>("/api/jobs")).jobs.filter((j) => j.kind === "precision" && j.status === "done").at(-1)!.result!.results[0];

// Excluding from a precision flag: the next run leaves the embryo out, says so and has one embryo fewer
// (common practice, no source: n counts the embryos a spread is computed from). The API is the reference.
describe("excluding an embryo from a precision flag, in chromium", () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await startBrowserSession({ demo: true });
    await s.page.goto(`${s.server.url}/#/precision`);
    await s.page.waitForSelector("[data-role=start-precision]");
  });
  afterAll(async () => s?.close());

  it("the flagged embryo's Exclude button asks for a reason; the re-run lists it as left out and has one embryo fewer", async () => {
    const { page } = s;
    await page.uncheck("input[name=genotypes][value=wt]");
    await page.check('input[name=genotypes][value="glm-2x"]');
    await page.check("input[name=channels][value=glm]");
    // Per-embryo min–max normalisation makes the demo's brightest-offset embryo of glm-2x stand out (an outlier flag to act on).
    await page.selectOption("select[name=normalisation]", "minmax");
    await page.fill("input[name=bootstrap]", "200");
    await page.click("[data-role=start-precision]");
    await page.waitForSelector("[data-role=precision-done]", { timeout: 60_000 });
    const first = await lastPrecision(s);
    expect(first.left_out).toEqual([]);
    const flagged = first.outliers.flagged[0].embryo;
    const result = page.locator(`.precision-result[data-analysis-id="${first.analysis_id}"]`);
    expect(await result.locator("[data-role=left-out]").innerText()).toContain("No embryo was left out.");

    await result.locator(`[data-role=precision-flags] li[data-embryo="${flagged}"] [data-role=exclude]`).click();
    await page.waitForSelector("[data-role=exclude-dialog]");
    await page.fill("[data-role=exclude-dialog] input[name=reason]", "bubble in the yolk");
    await page.click("[data-role=confirm-exclude]");
    await result.locator(`[data-role=precision-flags] li[data-embryo="${flagged}"] [data-role=excluded-note]`).waitFor();
    const { current } = await s.api<{ current: { embryo: string; reason: string }[] }>("/api/exclusions");
    expect(current).toEqual([expect.objectContaining({ embryo: flagged, reason: "bubble in the yolk" })]);

    await page.click("[data-role=start-precision]");
    await page.waitForSelector('.precision-result h2:has-text("left out")', { timeout: 120_000 });
    const second = await lastPrecision(s);
    expect(second.n_embryos).toBe(first.n_embryos - 1);
    expect(second.left_out).toEqual([expect.objectContaining({ embryo: flagged, reason: "bubble in the yolk" })]);
    const rerun = page.locator(`.precision-result[data-analysis-id="${second.analysis_id}"]`);
    expect(await rerun.locator("[data-role=left-out]").innerText()).toContain(`${flagged} (bubble in the yolk)`);
    expect(await rerun.locator("h2").innerText()).toContain(`${second.n_embryos} embryos (1 left out)`);
    await s.screenshot("precision-left-out");
  }, 240_000);

  it("the Data table shows the embryo as excluded with its reason, and Include again restores it", async () => {
    const { page } = s;
    const flagged = (await lastPrecision(s)).left_out[0].embryo;
    await page.goto(`${s.server.url}/#/data`);
    const filter = page.locator("section[aria-labelledby=embryos-title] select[name=genotype]");
    await filter.locator('option[value="glm-2x"]').waitFor({ state: "attached" });
    await filter.selectOption("glm-2x");
    const row = page.locator(`[data-role=embryo-list] tr[data-embryo="${flagged}"]`).first();
    await row.waitFor();
    expect(await row.locator("[data-role=excluded]").innerText()).toContain("excluded: bubble in the yolk");
    await row.locator("[data-role=include]").click();
    await page.locator(`[data-role=embryo-list] tr[data-embryo="${flagged}"] [data-role=exclude]`).first().waitFor();
    expect((await s.api<{ current: unknown[] }>("/api/exclusions")).current).toEqual([]);
    expect(s.pageErrors).toEqual([]);
  });
});
