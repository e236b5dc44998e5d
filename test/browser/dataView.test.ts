import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startBrowserSession, type BrowserSession } from "../helpers/browserSession.ts";

const WIDE = "fixtures/glimmerin_wide.csv";
const META = "fixtures/glimmerin_wide_meta.csv";
const PIXELS = "fixtures/glimmerin_wide_pixels.tsv";

interface ProfilePage {
  total: number;
}

// The Data view against the API it draws (the API is the reference; common practice, no source).
describe("Data view in chromium", () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await startBrowserSession();
    await s.page.goto(`${s.server.url}/#/data`);
    await s.page.waitForSelector("[data-role=import-list] table");
  });
  afterAll(async () => s?.close());

  it("files chosen in the file picker are previewed with shape, separator, columns and warnings, and nothing is stored before Import", async () => {
    const { page } = s;
    await page.setInputFiles("[data-role=file-input]", [WIDE, META]);
    const card = page.locator('.preview-card[data-file="glimmerin_wide.csv"]');
    await card.waitFor();
    expect(await card.getAttribute("data-status")).toBe("ok");
    const facts = await card.locator("dl.facts").innerText();
    expect(facts).toMatch(/Table shape\s+wide/);
    expect(facts).toMatch(/Separator\s+comma/);
    expect(facts).toMatch(/Decimal mark\s+point/);
    // Only one card: the side file is joined to the profiles, not previewed as profiles.
    expect(await page.locator(".preview-card").count()).toBe(1);
    const preview = await (async () => {
      const form = new FormData();
      form.append("files", new Blob([readFileSync(WIDE)]), "glimmerin_wide.csv");
      form.append("meta", new Blob([readFileSync(META)]), "glimmerin_wide_meta.csv");
      return (await (await fetch(`${s.server.url}/api/imports/preview`, { method: "POST", body: form })).json()) as { files: { embryos: unknown[]; warnings: { message: string }[]; columns: unknown[] }[] };
    })();
    expect(facts).toMatch(new RegExp(`Embryos\\s+${preview.files[0].embryos.length}\\b`));
    expect(await card.locator(".notice-warning").count()).toBe(preview.files[0].warnings.length);
    const warnings = await card.locator(".warnings").innerText();
    expect(warnings).toContain("rises away from the source end");
    // The hint names the page's field, not the command-line option.
    expect(warnings).toContain("Flip “auto”");
    expect(warnings).not.toContain("--flip");
    await card.locator("summary", { hasText: "Columns" }).click();
    expect(await card.locator("details").nth(1).locator("tbody tr").count()).toBe(preview.files[0].columns.length);
    expect((await s.api<ProfilePage>("/api/profiles")).total).toBe(0);
    await s.screenshot("data-preview");
  });

  it("Import stores the file and the embryo list then shows the stored profiles grouped by genotype", async () => {
    const { page } = s;
    await page.click("[data-role=confirm-import]");
    const report = page.locator("[data-role=import-result] .report");
    await report.first().waitFor();
    expect(await report.first().getAttribute("data-status")).toBe("imported");
    const stored = await s.api<ProfilePage>("/api/profiles");
    expect(stored.total).toBeGreaterThan(0);
    await page.waitForFunction((total) => document.querySelector("[data-role=page-info]")?.textContent === `1–50 of ${total} profiles`, stored.total);
    const groups = await page.locator("[data-role=embryo-list] tr.group-row").allInnerTexts();
    expect(groups[0]).toBe("Genotype glm-2x");
    expect(await page.locator("[data-role=embryo-list] tbody tr:not(.group-row)").count()).toBe(50);
    await s.screenshot("data-imported");
  });

  it("the embryo list filters on genotype and on a metadata KEY=VALUE, with the same counts as the API", async () => {
    const { page } = s;
    await page.selectOption("[data-role=embryo-list] >> xpath=.. >> select[name=genotype]", "tardy");
    const tardy = await s.api<ProfilePage>("/api/profiles?genotype=tardy");
    await page.waitForFunction((t) => document.querySelector("[data-role=page-info]")?.textContent === `1–${Math.min(50, t)} of ${t} profiles`, tardy.total);
    await page.selectOption("[data-role=embryo-list] >> xpath=.. >> select[name=genotype]", "");
    await page.fill("input[name=meta]", "mounting=lateral");
    await page.press("input[name=meta]", "Enter");
    await page.locator("input[name=meta]").blur();
    const lateral = await s.api<ProfilePage>("/api/profiles?meta.mounting=lateral");
    expect(lateral.total).toBeGreaterThan(0);
    await page.waitForFunction((t) => document.querySelector("[data-role=page-info]")?.textContent === `1–${Math.min(50, t)} of ${t} profiles`, lateral.total);
    await page.fill("input[name=meta]", "lateral");
    await page.locator("input[name=meta]").blur();
    await page.waitForSelector("[data-role=embryo-list] .notice-warning");
    expect(await page.locator("[data-role=embryo-list] .notice-warning").innerText()).toContain('"lateral" is not KEY=VALUE');
    await page.fill("input[name=meta]", "");
    await page.locator("input[name=meta]").blur();
  });

  it("a file dropped on the drop zone is previewed; a rejection names the missing pixel size in the page's words, and filling it in makes the file readable (already stored)", async () => {
    const { page } = s;
    const text = readFileSync(PIXELS, "utf8");
    const transfer = await page.evaluateHandle((t) => {
      const dt = new DataTransfer();
      dt.items.add(new File([t], "glimmerin_wide_pixels.tsv", { type: "text/tab-separated-values" }));
      return dt;
    }, text);
    await page.dispatchEvent("[data-role=drop-zone]", "drop", { dataTransfer: transfer });
    const card = page.locator('.preview-card[data-file="glimmerin_wide_pixels.tsv"]');
    await card.waitFor();
    expect(await card.getAttribute("data-status")).toBe("rejected");
    const why = await card.innerText();
    expect(why).toContain("the “Pixel size (µm)” field");
    expect(why).not.toContain("--pixel-size");
    expect(await page.locator("[data-role=confirm-import]").isDisabled()).toBe(true);
    // Source: fixtures/README.md (the pixel file is imported with a pixel size of 0.625 µm).
    await page.fill("input[name=pixelSizeUm]", "0.625");
    await page.locator("input[name=pixelSizeUm]").blur();
    // The pixel export holds the same profiles as the wide file imported above: readable now, and nothing new to add.
    await page.waitForSelector('.preview-card[data-file="glimmerin_wide_pixels.tsv"][data-status=already-imported]');
    expect(await card.locator("[data-role=outcome]").innerText()).toContain("every profile of this file is already stored unchanged");
    expect(await page.locator("[data-role=confirm-import]").isDisabled()).toBe(true);
    await s.screenshot("data-drop");
    await page.getByRole("button", { name: "Clear" }).click();
  });

  it("deleting an import asks first; Cancel keeps it, confirming removes what it added", async () => {
    const { page } = s;
    const { imports } = await s.api<{ imports: { id: number }[] }>("/api/imports");
    expect(imports).toHaveLength(1);
    await page.click("[data-role=delete-import]");
    const dialog = page.locator("dialog.confirm");
    await dialog.waitFor();
    expect(await dialog.innerText()).toContain(`Delete import #${imports[0].id}?`);
    await dialog.getByRole("button", { name: "Cancel" }).click();
    expect((await s.api<{ imports: unknown[] }>("/api/imports")).imports).toHaveLength(1);
    await page.click("[data-role=delete-import]");
    await page.locator("dialog.confirm").getByRole("button", { name: "Delete import" }).click();
    await page.waitForFunction(() => document.querySelector("[data-role=page-info]")?.textContent === "0 profiles");
    expect((await s.api<{ imports: unknown[] }>("/api/imports")).imports).toHaveLength(0);
    expect((await s.api<ProfilePage>("/api/profiles")).total).toBe(0);
    expect(s.pageErrors).toEqual([]);
  });
});
