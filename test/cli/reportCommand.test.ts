import { createHash } from "node:crypto";
import { existsSync, mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { formatWithError } from "../../client/figures/figureNumbers.ts";
import { openDatabaseSync } from "../../db/connection.ts";
import { listAnalyses } from "../../db/analyses.ts";
import { pngSize } from "../helpers/pngSize.ts";
import { runCliInProcess } from "../helpers/runCliInProcess.ts";
import { runPython } from "../helpers/python.ts";

// The report: a self-contained page with provenance, settings and caveats, plus figure and table files (common practice, no source).
describe("morphogauge report", () => {
  const dir = mkdtempSync(join(tmpdir(), "mg-report-"));
  const db = join(dir, "lab.db");
  const out = join(dir, "out");
  let run: Awaited<ReturnType<typeof runCliInProcess>>;
  let html: string;
  /** Whether the page holds `text` (the page is megabytes long, so failures name the text, not the page). */
  const has = (text: string) => expect(html.includes(text), `page contains ${JSON.stringify(text)}`).toBe(true);
  beforeAll(async () => {
    expect((await runCliInProcess(["demo", "--db", db])).code).toBe(0);
    run = await runCliInProcess(["report", "--db", db, "--out", "out", "--genotype", "wt", "--channel", "glm", "--bootstrap", "50", "--json"], {}, dir);
    html = readFileSync(join(out, "index.html"), "utf8");
  });

  it("report --json prints only the manifest of written files on stdout, and every listed file exists", () => {
    expect(run.code).toBe(0);
    expect(run.stderr).toBe("");
    const manifest = JSON.parse(run.stdout);
    expect(manifest.index).toBe("index.html");
    expect(manifest.figures.map((f: { kind: string }) => f.kind)).toEqual(["profile-fit", "profile-fit", "residuals", "ensemble", "sigma-x", "boundary", "decoding-map"]);
    for (const f of [...manifest.figures.flatMap((x: { png: string; svg: string }) => [x.png, x.svg]), ...manifest.tables]) expect(existsSync(join(out, f)), f).toBe(true);
    expect(manifest.ranByReport).toEqual({ fits: 30, precisionAnalyses: 1 });
  });

  it("report writes 300 dpi PNGs (1950 × 1200) and 650 × 400 SVGs", () => {
    const manifest = JSON.parse(run.stdout);
    for (const f of manifest.figures) {
      expect(pngSize(readFileSync(join(out, f.png)))).toEqual({ width: 1950, height: 1200 });
      expect(readFileSync(join(out, f.svg), "utf8")).toMatch(/^(<\?xml|<svg)[\s\S]*<svg[^>]*width="650"[^>]*height="400"/);
    }
  });

  it("index.html embeds every figure and makes no request outside itself", () => {
    const manifest = JSON.parse(run.stdout);
    expect(html.match(/<img [^>]*src="data:image\/png;base64,/g)).toHaveLength(manifest.figures.length);
    expect(/https?:\/\//.test(html), "no http:// or https://").toBe(false);
    expect(/<(script|link|iframe)\b/i.test(html), "no script, link or iframe").toBe(false);
    expect(/src="(?!data:)/.test(html), "every src is a data URI").toBe(false);
    expect(/<style>[\s\S]+<\/style>/.test(html), "inline style sheet").toBe(true);
  });

  it("index.html states the region behind the precision headlines, the headline σ_x and the extrapolated direct information", () => {
    // common practice, no source: every headline number carries the region and method it was computed with.
    has("Region for positional information and the headline σ_x:");
    has("trimmed by 10% at each end");
    has("Headline σ_x =");
    has("(direct estimate extrapolated to infinitely many embryos)");
  });

  it("index.html names the imported file with the SHA-256 of its bytes", () => {
    const sha = createHash("sha256").update(readFileSync(new URL("../../fixtures/glimmerin_long.csv", import.meta.url))).digest("hex");
    has("glimmerin_long.csv");
    has(sha);
  });

  it("index.html states the steady-state caveat, research use, the settings and engine version, and that it ran the missing analyses", () => {
    has("determines only λ = √(D/k)");
    has("D and k separately need a second measurement");
    has("conclusions rest with the lab&#39;s judgement");
    has("morphogauge-engine");
    has("30 profile(s) had no stored fit and were fitted by this report with the default options");
    has("ran one with the default settings and 50 bootstrap resamples");
    has("&quot;resamples&quot;: 50");
    has("&quot;seed&quot;: 1");
  });

  it("report stores what it ran, and a second report reuses it instead of running it again", async () => {
    const again = await runCliInProcess(["report", "--db", db, "--out", "out2", "--genotype", "wt", "--channel", "glm", "--json"], {}, dir);
    expect(JSON.parse(again.stdout).ranByReport).toEqual({ fits: 0, precisionAnalyses: 0 });
    const opened = openDatabaseSync(db);
    try {
      expect(listAnalyses(opened, "precision")).toHaveLength(1);
      expect(listAnalyses(opened, "global-fit")).toHaveLength(1);
    } finally {
      opened.close();
    }
  });

  it("report's fits.csv reads back with Python's csv module and agrees with the λ ± SE the page prints", async () => {
    const rows = await runPython<{ embryo: string; lambda_um: string; lambda_se_um: string }[]>("import csv, io\nresult = list(csv.DictReader(io.StringIO(data, newline='')))", readFileSync(join(out, "tables/fits.csv"), "utf8"));
    expect(rows).toHaveLength(30);
    for (const r of rows) {
      // The page prints λ to the precision of its SE (formatWithError); the CSV holds the full values.
      has(`<td>${r.embryo}</td><td class="num">—</td><td>exponential</td><td class="num">${formatWithError(Number(r.lambda_um), Number(r.lambda_se_um))}</td>`);
    }
  });

  it("report refuses an unknown genotype with exit 1 and names the stored ones", async () => {
    const r = await runCliInProcess(["report", "--db", db, "--out", "out3", "--genotype", "nope"], {}, dir);
    expect(r.code).toBe(1);
    expect(r.stderr).toContain('No profiles of genotype "nope" are stored');
    expect(r.stderr).toContain("wt");
  });
});
