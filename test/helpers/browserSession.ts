import { cpSync, existsSync, mkdirSync, mkdtempSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { chromium, type Browser, type Page } from "playwright-core";
import { buildClient } from "../../server/api/buildClient.ts";
import type { DataSets } from "../../server/services/datasets/dataSets.ts";
import { startTestServer, type TestServer } from "./testServer.ts";

/** Debian's chromium; CI installs it with apt-get. The browser tests never download a browser. */
export const CHROMIUM = "/usr/bin/chromium";

/** Flags for a headless run without GPU, network chatter or first-run screens. */
const CHROMIUM_ARGS = ["--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--no-first-run", "--disable-sync"];

const LOCK = join(tmpdir(), "morphogauge-client-build.lock");
/** A lock older than this was left by a crashed run. */
const STALE_LOCK_MS = 60_000;

/**
 * Build the client and copy it to a folder of this test file's own: the build
 * writes client/dist in place, and test files run in parallel, so the build
 * and the copy happen under a lock and each server serves a copy nobody rewrites.
 */
async function builtClientCopy(): Promise<string> {
  for (;;) {
    try {
      mkdirSync(LOCK);
      break;
    } catch {
      if (existsSync(LOCK) && Date.now() - statSync(LOCK).mtimeMs > STALE_LOCK_MS) rmSync(LOCK, { recursive: true, force: true });
      await new Promise((r) => setTimeout(r, 50));
    }
  }
  try {
    const dist = await buildClient();
    const copy = mkdtempSync(join(tmpdir(), "morphogauge-client-"));
    cpSync(dist, copy, { recursive: true });
    return copy;
  } finally {
    rmSync(LOCK, { recursive: true, force: true });
  }
}

export interface BrowserSession {
  server: TestServer;
  browser: Browser;
  page: Page;
  /** Console errors and uncaught exceptions of the page, for a final check. */
  pageErrors: string[];
  /** GET a JSON answer of the API directly (the reference the page is checked against). */
  api<T>(path: string): Promise<T>;
  screenshot(name: string): Promise<void>;
  close(): Promise<void>;
}

/**
 * The app on 127.0.0.1 (in-memory database, optionally the demo data) serving
 * the built client, and one headless chromium with a 1280×800 page on it.
 * Fails with a clear message when chromium is not installed: these tests do not skip.
 */
export async function startBrowserSession(options: { demo?: boolean; datasets?: DataSets } = {}): Promise<BrowserSession> {
  if (!existsSync(CHROMIUM)) {
    throw new Error(`The browser tests need Debian's chromium at ${CHROMIUM}, which is missing. Install it with "apt-get install chromium"; these tests do not skip.`);
  }
  const clientDir = await builtClientCopy();
  const server = await startTestServer({ demo: options.demo, datasets: options.datasets, clientDir });
  const browser = await chromium.launch({ executablePath: CHROMIUM, headless: true, args: CHROMIUM_ARGS });
  const context = await browser.newContext({ viewport: { width: 1280, height: 800 }, acceptDownloads: true });
  const page = await context.newPage();
  const pageErrors: string[] = [];
  page.on("pageerror", (e) => pageErrors.push(`uncaught: ${e.message}`));
  page.on("console", (m) => {
    if (m.type() === "error") pageErrors.push(`console: ${m.text()}`);
  });
  const outDir = join("test-output", "browser");
  mkdirSync(outDir, { recursive: true });
  return {
    server,
    browser,
    page,
    pageErrors,
    async api<T>(path: string): Promise<T> {
      const res = await fetch(`${server.url}${path}`);
      if (!res.ok) throw new Error(`GET ${path} answered ${res.status}: ${await res.text()}`);
      return (await res.json()) as T;
    },
    async screenshot(name: string) {
      await page.screenshot({ path: join(outDir, `${name}.png`), fullPage: true });
    },
    async close() {
      await browser.close();
      await server.close();
      rmSync(clientDir, { recursive: true, force: true });
    },
  };
}
