import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startBrowserSession, type BrowserSession } from "../helpers/browserSession.ts";
import { canvasInk } from "../helpers/canvasInk.ts";
import { downloadFile } from "../helpers/downloadFile.ts";
import { readNumbers } from "../helpers/readNumbers.ts";

interface JobList {
  jobs: { id: string; kind: string; status: string; createdAt: string; result: { results: { analysis_id: number; sigma_x_summary: { value: number; se: number }; information_region: { from: number; to: number }; boundary: { sd: number; positions: Record<string, number> }; positional_information_bits: { small_noise: { value: number }; direct_extrapolated: { value: number } } }[] } | null }[];
}

/** Record every progress state the page shows, from before the job starts. */
async function watchProgress(s: BrowserSession): Promise<void> {
  await s.page.evaluate(() => {
    const seen: string[] = [];
    (window as unknown as { progressSeen: string[] }).progressSeen = seen;
    new MutationObserver(() => {
      const box = document.querySelector<HTMLElement>(".job-progress");
      if (!box) return;
      const state = `${box.dataset.status}|${box.querySelector(".job-percent")?.textContent}|${box.querySelector(".job-stage")?.textContent}`;
      if (seen[seen.length - 1] !== state) seen.push(state);
    }).observe(document.body, { subtree: true, childList: true, characterData: true, attributes: true });
  });
}

const progressSeen = (s: BrowserSession) => s.page.evaluate(() => (window as unknown as { progressSeen: string[] }).progressSeen);

// The Precision view against the precision job's result (the API is the reference; common practice, no source).
describe("Precision view in chromium", () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await startBrowserSession({ demo: true });
    await s.page.goto(`${s.server.url}/#/precision`);
    await s.page.waitForSelector("[data-role=start-precision]");
  });
  afterAll(async () => s?.close());

  it("a precision run shows its percent and stage while it runs and ends done, with the job's numbers on the page", async () => {
    const { page } = s;
    await page.check("input[name=genotypes][value=wt]");
    await page.check("input[name=channels][value=glm]");
    await page.selectOption("select[name=boundaryBy]", "threshold");
    await page.fill("input[name=boundaryValue]", "400");
    await page.fill("input[name=bootstrap]", "1000");
    await watchProgress(s);
    await page.click("[data-role=start-precision]");
    await page.waitForSelector("[data-role=precision-done]", { timeout: 45_000 });
    const seen = await progressSeen(s);
    const running = seen.filter((p) => p.startsWith("running|"));
    expect(running.some((p) => /\|([1-9]\d?)%\|/.test(p))).toBe(true);
    expect(running.some((p) => p.includes("bootstrap"))).toBe(true);
    expect(seen[seen.length - 1]).toMatch(/^done\|100%\|done$/);

    const { jobs } = await s.api<JobList>("/api/jobs");
    const job = jobs.filter((j) => j.kind === "precision" && j.status === "done").at(-1)!;
    const r = job.result!.results[0];
    const section = page.locator(`.precision-result[data-analysis-id="${r.analysis_id}"]`);
    const [headline, headlineSe] = readNumbers(await section.locator('[data-key="sigma-x-summary"] dd').innerText());
    expect(Math.abs(headline.value - r.sigma_x_summary.value)).toBeLessThanOrEqual(headline.halfUnit + 1e-9);
    expect(Math.abs(headlineSe.value - r.sigma_x_summary.se)).toBeLessThanOrEqual(headlineSe.halfUnit + 1e-9);
    const [from, to] = readNumbers(await section.locator('[data-key="information-region"] dd').innerText());
    expect(Math.abs(from.value - r.information_region.from)).toBeLessThanOrEqual(from.halfUnit + 1e-9);
    expect(Math.abs(to.value - r.information_region.to)).toBeLessThanOrEqual(to.halfUnit + 1e-9);
    const [extrapolated] = readNumbers(await section.locator('[data-key="pi-extrapolated"] dd').innerText());
    expect(Math.abs(extrapolated.value - r.positional_information_bits.direct_extrapolated.value)).toBeLessThanOrEqual(extrapolated.halfUnit + 1e-9);
    const [sd] = readNumbers(await section.locator('[data-key="boundary-sd"] dd').innerText());
    expect(Math.abs(sd.value - r.boundary.sd)).toBeLessThanOrEqual(sd.halfUnit + 1e-9);
    const [bits] = readNumbers(await section.locator('[data-key="pi-small-noise"] dd').innerText());
    expect(Math.abs(bits.value - r.positional_information_bits.small_noise.value)).toBeLessThanOrEqual(bits.halfUnit + 1e-9);
    expect(await section.locator(".table-block tbody tr").count()).toBe(Object.keys(r.boundary.positions).length);
    const method = await section.locator(".notice-info").first().innerText();
    expect(method).toContain("Normalisation: none");
    expect(method).toContain("Savitzky–Golay");
  });

  it("the mean ± SD, σ_x, boundary and decoding-map figures all draw, and σ_x exports as SVG from the server", async () => {
    const { page } = s;
    const canvases = page.locator(".precision-result canvas");
    expect(await canvases.count()).toBe(4);
    await page.waitForTimeout(300);
    for (let i = 0; i < 4; i++) {
      const ink = await canvasInk(canvases.nth(i));
      expect(ink.inkFraction).toBeGreaterThan(0.01);
      expect(ink.seriesPixels).toBeGreaterThan(100);
    }
    const sigma = page.locator('.precision-result .chart-panel[data-figure="sigma-x"]');
    const svg = await downloadFile(page, sigma.locator("[data-role=svg]"));
    expect(svg.bytes.toString("utf8")).toMatch(/<svg[\s>]/);
    const csv = await downloadFile(page, page.locator(".precision-result [data-role=csv-precision]"));
    expect(csv.bytes.toString("utf8").split(/\r?\n/)[0]).toMatch(/sigma_x/);
    await s.screenshot("precision-result");
  });

  it("Cancel stops a running analysis, and the page says so in plain words", async () => {
    const { page } = s;
    // Long enough to cancel, within the compute budget (README, "Safety").
    await page.fill("input[name=bootstrap]", "20000");
    await watchProgress(s);
    await page.click("[data-role=start-precision]");
    await page.waitForSelector('.job-progress[data-status="running"]');
    await page.click("[data-role=cancel-job]");
    await page.waitForSelector("[data-role=precision-progress] .notice-info");
    expect(await page.locator("[data-role=precision-progress]").innerText()).toContain("The analysis was cancelled; nothing was stored.");
    const { jobs } = await s.api<JobList>("/api/jobs");
    expect(jobs.filter((j) => j.kind === "precision").at(-1)!.status).toBe("cancelled");
    expect(await page.locator("[data-role=start-precision]").isDisabled()).toBe(false);
    expect(s.pageErrors).toEqual([]);
  });
});
