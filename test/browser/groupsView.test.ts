import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startBrowserSession, type BrowserSession } from "../helpers/browserSession.ts";
import { canvasInk } from "../helpers/canvasInk.ts";
import { downloadFile, PNG_SIGNATURE } from "../helpers/downloadFile.ts";
import { readNumbers } from "../helpers/readNumbers.ts";

interface Job<R> {
  kind: string;
  status: string;
  result: R | null;
}
interface Comparison {
  analysis_id: number;
  contrasts: { a: string; b: string; p_holm: number | null; difference: { value: number } }[];
}
interface Tracking {
  analysis_id: number;
  result: { lambda_from_shift_um: { value: number; se: number }; agree: boolean; no_crossing: { before_start: number; beyond_end: number } };
}
interface Plan {
  analysis_id: number;
  n_required: number;
  table: { n: number }[];
}

async function lastResult<R>(s: BrowserSession, kind: string): Promise<R> {
  const { jobs } = await s.api<{ jobs: Job<R>[] }>("/api/jobs");
  return jobs.filter((j) => j.kind === kind && j.status === "done").at(-1)!.result!;
}

// The Groups view against the comparison, tracking and plan jobs' results (the API is the reference; common practice, no source).
describe("Groups view in chromium", () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await startBrowserSession({ demo: true });
    await s.page.goto(`${s.server.url}/#/groups`);
    await s.page.waitForSelector("[data-role=start-compare]");
  });
  afterAll(async () => s?.close());

  it("a comparison shows every contrast of the job with its difference and Holm p, and the per-embryo figure draws", async () => {
    const { page } = s;
    const compare = page.locator("section", { has: page.locator("#compare-title") });
    for (const g of ["glm-0.5x", "glm-4x"]) await compare.locator(`input[name=genotypes][value="${g}"]`).uncheck();
    await compare.locator("select[name=reference]").selectOption("wt");
    await compare.locator("input[name=permutations]").fill("999");
    await compare.locator("input[name=bootstrap]").fill("500");
    await page.click("[data-role=start-compare]");
    await page.waitForSelector(".comparison-result", { timeout: 45_000 });
    const r = await lastResult<Comparison>(s, "compare");
    expect(r.contrasts).toHaveLength(2);
    const headers = await page.locator(".comparison-result table").nth(1).locator("thead th").allInnerTexts();
    const holmColumn = headers.indexOf("Holm p");
    expect(holmColumn).toBeGreaterThan(0);
    // The table says which interval is the headline and which is the second opinion (Welch 1947; Fieller 1954).
    expect(headers[2]).toContain("Welch t");
    expect(headers[3]).toContain("Fieller");
    expect(headers.filter((h) => h.includes("second opinion"))).toHaveLength(2);
    for (const c of r.contrasts) {
      const cells = await page.locator(`.comparison-result tr[data-pair="${c.a}|${c.b}"] td`).allInnerTexts();
      expect(cells[0]).toBe(`${c.a} vs ${c.b}`);
      const [difference] = readNumbers(cells[2]);
      expect(Math.abs(difference.value - c.difference.value)).toBeLessThanOrEqual(difference.halfUnit + 1e-9);
      if (c.p_holm! < 0.001) expect(cells[holmColumn]).toBe("< 0.001");
      else {
        const [holm] = readNumbers(cells[holmColumn]);
        expect(Math.abs(holm.value - c.p_holm!)).toBeLessThanOrEqual(holm.halfUnit + 1e-12);
      }
    }
    const ink = await canvasInk(page.locator('.comparison-result canvas[data-figure="group-values"]'));
    expect(ink.inkFraction).toBeGreaterThan(0.01);
    expect(await page.locator(".comparison-result [data-role=csv]").first().getAttribute("href")).toBe(`api/exports/comparison.csv?analysis=${r.analysis_id}`);
  });

  it("a dosage series gives λ from the boundary shift beside λ from the fits, says whether they agree, and exports its figure as PNG", async () => {
    const { page } = s;
    const track = page.locator("section", { has: page.locator("#track-title") });
    await track.locator("select[name=over]").selectOption("dosage");
    for (const g of ["glm-0.5x", "glm-2x", "glm-4x", "wt"]) await track.locator(`input[name=genotypes][value="${g}"]`).check();
    await page.click("[data-role=start-track]");
    await page.waitForSelector(".tracking-result", { timeout: 45_000 });
    const r = await lastResult<Tracking>(s, "track");
    const [shift, se] = readNumbers(await page.locator('.tracking-result [data-key="lambda-shift"] dd').innerText());
    expect(Math.abs(shift.value - r.result.lambda_from_shift_um.value)).toBeLessThanOrEqual(shift.halfUnit + 1e-9);
    expect(Math.abs(se.value - r.result.lambda_from_shift_um.se)).toBeLessThanOrEqual(se.halfUnit + 1e-9);
    expect(await page.locator('.tracking-result [data-key="agree"] dd').innerText()).toMatch(r.result.agree ? /^yes/ : /^no/);
    const uncrossed = r.result.no_crossing.before_start + r.result.no_crossing.beyond_end;
    expect(await page.locator('.tracking-result [data-key="no-crossing"] dd').innerText()).toMatch(new RegExp(`^${uncrossed}\\b`));
    const png = await downloadFile(page, page.locator('.tracking-result .chart-panel[data-figure="trend"] [data-role=png]'));
    expect(png.bytes.subarray(0, 8).equals(PNG_SIGNATURE)).toBe(true);
  });

  it("the planner gives the embryos per group and the power table of the plan job", async () => {
    const { page } = s;
    const plan = page.locator("section", { has: page.locator("#plan-title") });
    await plan.locator("input[name=effect]").fill("10");
    await plan.locator("select[name=group]").selectOption("wt");
    await page.click("[data-role=start-plan]");
    await page.waitForSelector(".plan-result", { timeout: 45_000 });
    const r = await lastResult<Plan>(s, "plan");
    expect(await page.locator('.plan-result [data-key="n-required"] dd').innerText()).toMatch(new RegExp(`^${r.n_required}\\b`));
    expect(await page.locator(".plan-result tbody tr").count()).toBe(r.table.length);
    const csv = await downloadFile(page, page.locator(".plan-result [data-role=csv]"));
    expect(csv.bytes.toString("utf8").trim().split(/\r?\n/)).toHaveLength(r.table.length + 1);
    await s.screenshot("groups-results");
  });

  it("a request the API refuses is explained in plain words, without a stack trace", async () => {
    const { page } = s;
    const plan = page.locator("section", { has: page.locator("#plan-title") });
    await plan.locator("input[name=effect]").fill("0");
    await page.click("[data-role=start-plan]");
    const alert = page.locator("[data-role=plan-progress] [role=alert]");
    await alert.waitFor();
    const text = await alert.innerText();
    expect(text).toContain("effect must not be 0");
    expect(text).not.toMatch(/\bat .*\.ts:\d+/);
    expect(s.pageErrors.filter((e) => !e.includes("400"))).toEqual([]);
  });
});
