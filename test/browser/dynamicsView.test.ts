import { mkdirSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { loadDynamicsDemo } from "../../server/services/demoData.ts";
import { startBrowserSession, type BrowserSession } from "../helpers/browserSession.ts";
import { canvasInk } from "../helpers/canvasInk.ts";

// The Dynamics view against the API's answers (the API is the reference; common practice, no source).
describe("Dynamics view in chromium", () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await startBrowserSession({ demo: true });
    loadDynamicsDemo(s.server.db);
    await s.page.goto(`${s.server.url}/#/dynamics`);
    await s.page.waitForSelector("[data-section=what-if]");
  }, 120_000);
  afterAll(async () => s?.close());

  it("the what-if simulator draws the build-up and redraws it when a slider moves, with λ = √(D/k) shown", async () => {
    const { page } = s;
    const canvas = page.locator("[data-role=what-if-result] canvas[data-figure=simulation]");
    await canvas.waitFor({ timeout: 60_000 });
    const lambdaBefore = await page.locator("[data-role=what-if-result] [data-key=lambda] dd").innerText();
    // Source: λ = √(D/k) = √(0.3/2e-4) = 38.7 µm (science notes §1).
    expect(lambdaBefore).toBe("38.7 µm");
    await page.locator("[data-role=slider-k]").evaluate((el: HTMLInputElement) => {
      el.value = String(Math.log10(3e-5));
      el.dispatchEvent(new Event("input"));
      el.dispatchEvent(new Event("change"));
    });
    await page.waitForFunction(() => document.querySelector("[data-role=what-if-result] [data-key=lambda] dd")?.textContent === "100 µm", undefined, { timeout: 60_000 });
    const ink = await canvasInk(page.locator("[data-role=what-if-result] canvas[data-figure=simulation]"));
    expect(ink.inkFraction).toBeGreaterThan(0.01);
  });

  it("the demo FRAP curves are fitted and shown with the stored analysis's D, and the combine form receives its id", async () => {
    const { page } = s;
    // The FRAP drop area asks for recovery tables, not profile exports (common practice, no source: say what belongs there).
    expect(await page.locator("[data-section=frap] .drop-title").innerText()).toContain("FRAP recovery tables");
    await page.click("[data-role=fit-demo-frap]");
    await page.waitForSelector("[data-role=frap-result]", { timeout: 120_000 });
    const list = await s.api<{ analyses: { id: number; kind: string }[] }>("/api/dynamics/analyses");
    const frap = list.analyses.find((a) => a.kind === "frap")!;
    const stored = await s.api<{ result: { D_um2_per_s: { value: number } } }>(`/api/dynamics/analyses/${frap.id}`);
    const text = await page.locator("[data-role=frap-result] [data-key=D_um2_per_s] dd").innerText();
    expect(Number(text.split(" ")[0])).toBeCloseTo(stored.result.D_um2_per_s.value, 1);
    expect(await page.locator("input[name=frap-analysis]").inputValue()).toBe(String(frap.id));
    expect(await page.locator("[data-role=frap-result] canvas[data-figure=frap-recovery]").count()).toBe(1);
  });

  it("the build-up fit shows D, k, the profile likelihood and τ(x) for the demo time course", async () => {
    const { page } = s;
    await page.selectOption("[data-section=build-up] select[name=channel]", "glm-gfp");
    await page.click("[data-role=fit-build-up]");
    await page.waitForSelector("[data-role=build-up-result]", { timeout: 240_000 });
    for (const figure of ["build-up", "build-up-residuals", "profile-likelihood-k", "dk-region", "accumulation-time"]) expect(await page.locator(`[data-role=build-up-result] canvas[data-figure=${figure}]`).count()).toBe(1);
    expect(await page.locator("[data-role=build-up-result] [data-key=k_per_s] dd").innerText()).toMatch(/1\/s/);
    mkdirSync("test-output", { recursive: true });
    await page.screenshot({ path: "test-output/dynamics-view.png", fullPage: true });
  }, 300_000);
});
