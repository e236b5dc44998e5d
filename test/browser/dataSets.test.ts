import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DataSets } from "../../server/services/datasets/dataSets.ts";
import { startBrowserSession, type BrowserSession } from "../helpers/browserSession.ts";

// The page against the API it draws (the API is the reference; common practice, no source).
const lines = (length: number, channel: string, offset: number) =>
  ["lab-1", "lab-2"].flatMap((e, k) => [0, 1, 2, 3, 4, 5].map((i) => `${e},wt,${length + k},${channel},${i * 10},${200 - i * 15 + k + offset}`));
const header = "embryo,genotype,length [µm],channel,position [µm],intensity";

describe("data sets in chromium", () => {
  let s: BrowserSession;
  let dir: string;
  const marker = () => s.page.locator("[data-role=dataset-marker]");

  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), "mg-browser-datasets-"));
    writeFileSync(join(dir, "lab.csv"), [header, ...lines(500, "glm", 0)].join("\n") + "\n");
    writeFileSync(join(dir, "lab-vellin.csv"), [header, ...lines(470, "vellin", 7)].join("\n") + "\n");
    const datasets = await DataSets.open({ userPath: join(dir, "morphogauge.db"), demoPath: join(dir, "morphogauge-demo.db"), start: "demo" });
    s = await startBrowserSession({ datasets });
    await s.page.goto(`${s.server.url}/#/data`);
    await s.page.waitForSelector("[data-role=import-list] table");
  }, 120_000);
  afterAll(async () => s?.close());

  it("every view is marked \u201cdemo data (invented)\u201d while the demo is open", async () => {
    for (const view of ["data", "fits", "precision", "groups"]) {
      await s.page.click(`nav a[data-view=${view}]`);
      await marker().waitFor();
      expect(await marker().innerText()).toBe("demo data (invented)");
      expect(await marker().getAttribute("data-kind")).toBe("demo");
    }
    await s.screenshot("datasets-demo-marker");
    await s.page.click("nav a[data-view=data]");
  });

  it("files chosen while the demo is open are held until a data set of the lab's is chosen, then previewed and imported there", async () => {
    const { page } = s;
    const demoTotal = (await s.api<{ total: number }>("/api/profiles")).total;
    await page.setInputFiles("[data-role=file-input]", [join(dir, "lab.csv")]);
    await page.waitForSelector("[data-role=demo-import-guard]");
    expect((await s.api<{ total: number }>("/api/profiles")).total).toBe(demoTotal);
    await page.click('[data-role=use-own-dataset][data-dataset="morphogauge.db"]');
    await page.waitForSelector('.preview-card[data-file="lab.csv"][data-status=ok]');
    expect(await marker().innerText()).toBe("your data: morphogauge.db");
    await page.click("[data-role=confirm-import]");
    await page.waitForSelector("[data-role=import-result] .report[data-status=imported]");
    const mine = await s.api<{ total: number; items: { embryo: string }[] }>("/api/profiles");
    expect(mine.total).toBe(2);
    expect((await s.api<{ current: { id: string } }>("/api/datasets")).current.id).toBe("morphogauge.db");
  });

  it("a file whose embryos are stored with other lengths shows the conflicts and imports only after a choice, which does what it says", async () => {
    const { page } = s;
    await page.setInputFiles("[data-role=file-input]", [join(dir, "lab-vellin.csv")]);
    const card = page.locator('.preview-card[data-file="lab-vellin.csv"]');
    await page.waitForSelector('.preview-card[data-file="lab-vellin.csv"][data-status=conflicts]');
    expect(await page.locator("[data-role=confirm-import]").isDisabled()).toBe(true);
    const row = card.locator('[data-role=stored-embryos] tr[data-embryo="lab-1"]');
    expect(await row.innerText()).toContain("length (µm): 500 stored, 470 in the file");
    expect(await row.innerText()).toContain("channel vellin");
    await s.screenshot("datasets-conflicts");
    await page.check('[data-role=conflict-choice] input[value="replace"]');
    await page.waitForSelector('.preview-card[data-file="lab-vellin.csv"][data-status=ok]');
    expect(await card.locator("[data-role=outcome]").innerText()).toContain("replaced the length (µm) of 2 embryos");
    await page.click("[data-role=confirm-import]");
    await page.waitForSelector("[data-role=import-result] .report[data-status=imported]");
    const stored = await s.api<{ items: { embryo: string; lengthUm: number; channel: string }[] }>("/api/profiles");
    expect(stored.items.filter((p) => p.embryo === "lab-1").map((p) => p.lengthUm)).toEqual([470, 470]);
  });

  it("switching back to the demo from the top bar redraws the view from the demo, unchanged", async () => {
    const { page } = s;
    await page.selectOption("[data-role=dataset-bar] select[name=dataset]", "demo");
    await page.waitForFunction(() => document.querySelector("[data-role=dataset-marker]")?.getAttribute("data-kind") === "demo");
    const demo = await s.api<{ total: number }>("/api/profiles");
    await page.waitForFunction((t) => document.querySelector("[data-role=page-info]")?.textContent === `1–50 of ${t} profiles`, demo.total);
    expect((await s.api<{ total: number }>("/api/profiles?genotype=wt")).total).toBeGreaterThan(0);
    expect(await page.locator("[data-role=embryo-list]").innerText()).not.toContain("lab-1");
    expect(s.pageErrors).toEqual([]);
  });
});
