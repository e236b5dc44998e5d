import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startBrowserSession, type BrowserSession } from "../helpers/browserSession.ts";
import { canvasInk } from "../helpers/canvasInk.ts";
import { downloadFile, PNG_SIGNATURE, pngSize } from "../helpers/downloadFile.ts";
import { readNumbers } from "../helpers/readNumbers.ts";

interface FitItem {
  fitId: number;
  embryo: string;
  model: string;
  lambdaUm: { value: number; se: number; ci95: [number, number] } | null;
}

// The Fits view against GET /api/fits and the figure endpoints (the API is the reference; common practice, no source).
describe("Fits view in chromium", () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await startBrowserSession({ demo: true });
    await s.page.goto(`${s.server.url}/#/fits`);
    await s.page.waitForSelector("[data-role=start-fit]");
  });
  afterAll(async () => s?.close());

  it("states plainly that one steady-state profile gives λ = √(D/k) only, and what D and k need", async () => {
    const caveat = await s.page.locator(".notice-info").first().innerText();
    expect(caveat).toContain("λ = √(D/k)");
    expect(caveat).toContain("not D and k separately");
    expect(caveat).toContain("FRAP");
  });

  it("a fit run shows its progress, then the table lists λ ± SE and the 95% CI of every fit exactly as GET /api/fits gives them", async () => {
    const { page } = s;
    await page.selectOption(".fit-form select[name=genotype]", "wt");
    await page.selectOption(".fit-form select[name=channel]", "glm");
    await page.check(".fit-form input[value=finite]");
    await page.click("[data-role=start-fit]");
    await page.waitForSelector(".job-progress progress");
    await page.waitForSelector("[data-role=fit-done]", { timeout: 30_000 });
    // The demo comes from a localized source, so AICc prefers the source model over both fitted ones (fixtures/demoScenario.ts).
    expect(await page.locator(".fit-form .notice").allInnerTexts()).toEqual(expect.arrayContaining([expect.stringMatching(/wt \/ glm: AICc prefers the source model, not the fitted exponential/)]));
    const { fits } = await s.api<{ fits: FitItem[] }>("/api/fits?genotype=wt&channel=glm");
    expect(fits).toHaveLength(60);
    await page.waitForFunction((n) => document.querySelectorAll("[data-role=fit-table] tr[data-fit-id]").length === n, fits.length);
    for (const f of fits) {
      const row = page.locator(`[data-role=fit-table] tr[data-fit-id="${f.fitId}"]`);
      const cells = await row.locator("td").allInnerTexts();
      expect(cells[0]).toBe(f.embryo);
      expect(cells[2]).toBe(f.model);
      const [value, se] = readNumbers(cells[3]);
      expect(Math.abs(value.value - f.lambdaUm!.value)).toBeLessThanOrEqual(value.halfUnit + 1e-9);
      expect(Math.abs(se.value - f.lambdaUm!.se)).toBeLessThanOrEqual(se.halfUnit + 1e-9);
      const [lo, hi] = readNumbers(cells[4]);
      expect(Math.abs(lo.value - f.lambdaUm!.ci95[0])).toBeLessThanOrEqual(lo.halfUnit + 1e-9);
      expect(Math.abs(hi.value - f.lambdaUm!.ci95[1])).toBeLessThanOrEqual(hi.halfUnit + 1e-9);
      expect(cells[5]).toBe("converged");
    }
    // Akaike weights of the two models of one profile sum to 1 (Source: Burnham & Anderson 2002, Model Selection and Multimodel Inference, eq. 2.14).
    const weights = await page.locator('[data-role=fit-table] tr[data-embryo="wt-01"]').evaluateAll((rows) => rows.map((r) => Number(r.querySelectorAll("td")[6].textContent)));
    expect(weights).toHaveLength(2);
    expect(weights[0] + weights[1]).toBeCloseTo(1, 1);
    await s.screenshot("fits-table");
  });

  it("the table's CSV link is the server export with the same filters, and the global fit of the group is shown beside the per-embryo spread", async () => {
    const { page } = s;
    const csv = page.locator("[data-role=fit-table] [data-role=csv]");
    expect(await csv.getAttribute("href")).toBe("api/exports/fits.csv?genotype=wt&channel=glm");
    const file = await downloadFile(page, csv);
    const lines = file.bytes.toString("utf8").trim().split(/\r?\n/);
    expect(lines).toHaveLength(61);
    const cards = page.locator("[data-role=global-fits] .global-fit");
    await cards.first().waitFor();
    expect(await cards.count()).toBe(2);
    expect(await cards.first().locator('[data-key="global-lambda"] dd').innerText()).toMatch(/^\d+\.\d+ ± \d\.\d+ µm \[\d+\.\d+, \d+\.\d+\]$/);
    expect(await cards.first().innerText()).toContain("Model ranking for the group");
  });

  it("opening a row by keyboard draws the profile on linear and semi-log axes and the residuals on canvases that are not blank", async () => {
    const { page } = s;
    const { fits } = await s.api<{ fits: FitItem[] }>("/api/fits?genotype=wt&channel=glm&model=exponential");
    const target = fits.find((f) => f.embryo === "wt-03")!;
    const row = page.locator(`[data-role=fit-table] tr[data-fit-id="${target.fitId}"]`);
    await row.focus();
    await page.keyboard.press("Enter");
    await page.waitForSelector(`.fit-detail[data-fit-id="${target.fitId}"] canvas`);
    const canvases = page.locator(".fit-detail canvas");
    expect(await canvases.count()).toBe(3);
    await page.waitForFunction(() => [...document.querySelectorAll(".fit-detail canvas")].every((c) => (c as HTMLCanvasElement).dataset.figure && (c as HTMLCanvasElement).width > 0));
    await page.waitForTimeout(200);
    for (let i = 0; i < 3; i++) {
      const ink = await canvasInk(canvases.nth(i));
      expect(ink.inkFraction).toBeGreaterThan(0.01);
      expect(ink.colours).toBeGreaterThan(3);
      expect(ink.seriesPixels).toBeGreaterThan(200);
    }
    expect(await page.locator(".fit-detail [data-role=fit-window]").innerText()).toMatch(/^Window: (whole profile, )?[\d.]+–[\d.]+ µm/);
    expect(await page.locator(".fit-detail [data-role=fit-error-model]").innerText()).toContain("Error model: HC3 sandwich covariance");
    const lambda = await page.locator('.fit-detail tr[data-parameter="lambdaUm"] td').nth(2).innerText();
    const [value] = readNumbers(lambda);
    expect(Math.abs(value.value - target.lambdaUm!.value)).toBeLessThanOrEqual(value.halfUnit + 1e-9);
    await s.screenshot("fits-detail");
  });

  it("PNG and SVG buttons download the server's rendering of the same fit: a 300 dpi PNG and an SVG document", async () => {
    const { page } = s;
    const fitId = await page.locator(".fit-detail").getAttribute("data-fit-id");
    const linear = page.locator(".fit-detail .chart-panel").nth(0);
    expect(await linear.locator("[data-role=png]").getAttribute("href")).toBe(`api/figures/profile-fit?fit=${fitId}&format=png`);
    const png = await downloadFile(page, linear.locator("[data-role=png]"));
    expect(png.bytes.subarray(0, 8).equals(PNG_SIGNATURE)).toBe(true);
    // 6.5 × 4 inches at 300 dpi (the figure size of client/figures/figureTheme.ts).
    expect(pngSize(png.bytes)).toEqual({ width: 1950, height: 1200 });
    expect(png.bytes.length).toBeGreaterThan(20_000);
    const semiLog = page.locator(".fit-detail .chart-panel").nth(1);
    expect(await semiLog.locator("[data-role=svg]").getAttribute("href")).toBe(`api/figures/profile-fit?fit=${fitId}&scale=log&format=svg`);
    const svg = await downloadFile(page, semiLog.locator("[data-role=svg]"));
    const text = svg.bytes.toString("utf8");
    expect(text).toMatch(/<svg[\s>]/);
    expect(text.trim().endsWith("</svg>")).toBe(true);
    expect(svg.name).toMatch(/\.svg$/);
    expect(s.pageErrors).toEqual([]);
  });
});
