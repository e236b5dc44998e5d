import { request } from "node:http";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ServerLimits } from "../../server/serverLimits.ts";
import { tokensEqual } from "../../server/api/guards/accessToken.ts";
import { databaseSnapshot } from "../helpers/databaseSnapshot.ts";
import { PAGE_WRITE_HEADERS, startTestServer, uploadForm, type TestServer } from "../helpers/testServer.ts";

// Who may use the API: same-origin pages, the right Host, a token when shared (common practice for local web servers, no source).

/** A raw HTTP request, so that headers fetch would not let us set (Host) can be sent. */
function raw(url: string, options: { method?: string; headers?: Record<string, string>; body?: string }): Promise<{ status: number; headers: Record<string, unknown>; body: string }> {
  return new Promise((resolve, reject) => {
    const req = request(url, { method: options.method ?? "GET", headers: options.headers }, (res) => {
      let body = "";
      res.on("data", (c) => (body += c));
      res.on("end", () => resolve({ status: res.statusCode!, headers: res.headers, body }));
    });
    req.on("error", reject);
    if (options.body) req.write(options.body);
    req.end();
  });
}

describe("requests from elsewhere are refused", () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer({ demo: true });
  });
  afterAll(async () => s.close());

  it("a request whose Host is another site's name (DNS rebinding) gets 421 and nothing", async () => {
    const r = await raw(`${s.url}/api/imports`, { headers: { host: "attacker.example:5178" } });
    expect(r.status).toBe(421);
    expect(JSON.parse(r.body).error.message).toContain('does not answer to the host name "attacker.example:5178"');
    expect((await raw(`${s.url}/api/health`, { headers: { host: "localhost" } })).status).toBe(200);
  });

  it("a text/plain POST that would start a fit is refused and starts nothing", async () => {
    const before = databaseSnapshot(s.db);
    const r = await fetch(`${s.url}/api/fits`, { method: "POST", headers: { "content-type": "text/plain" }, body: JSON.stringify({}) });
    expect(r.status).toBe(403);
    expect((await r.json()).error.code).toBe("missing-header");
    // Even with the header, a JSON route wants a JSON body.
    const r2 = await fetch(`${s.url}/api/fits`, { method: "POST", headers: { "content-type": "text/plain", ...PAGE_WRITE_HEADERS }, body: "{}" });
    expect(r2.status).toBe(415);
    expect(databaseSnapshot(s.db)).toEqual(before);
  });

  it("a multipart upload or a delete without X-Requested-With is refused and changes nothing", async () => {
    const before = databaseSnapshot(s.db);
    const form = uploadForm({ "a.csv": "position [µm],Z1\n0,10\n1,9\n2,8\n3,7\n4,6\n5,5\n" }, { genotype: "wt" });
    expect((await fetch(`${s.url}/api/imports`, { method: "POST", body: form })).status).toBe(403);
    expect((await fetch(`${s.url}/api/imports/1`, { method: "DELETE" })).status).toBe(403);
    expect(databaseSnapshot(s.db)).toEqual(before);
  });

  it("an Origin or Sec-Fetch-Site of another site is refused, also on reads of the API", async () => {
    const other = await fetch(`${s.url}/api/imports`, { headers: { origin: "http://127.0.0.1:1" } });
    expect(other.status).toBe(403);
    expect((await fetch(`${s.url}/api/imports`, { headers: { "sec-fetch-site": "cross-site" } })).status).toBe(403);
    expect((await fetch(`${s.url}/api/imports`, { headers: { "sec-fetch-site": "same-site" } })).status).toBe(403);
    expect((await fetch(`${s.url}/api/imports`, { headers: { origin: s.url, "sec-fetch-site": "same-origin" } })).status).toBe(200);
  });

  it("every answer carries the content policy, nosniff and a referrer policy; no source map is served", async () => {
    const r = await fetch(`${s.url}/api/health`);
    expect(r.headers.get("content-security-policy")).toContain("default-src 'self'; object-src 'none'; frame-ancestors 'none'");
    expect(r.headers.get("x-content-type-options")).toBe("nosniff");
    expect(r.headers.get("referrer-policy")).toBe("no-referrer");
    const docs = await fetch(`${s.url}/api/docs`);
    expect(docs.headers.get("content-security-policy")).toMatch(/script-src 'none'; style-src 'sha256-/);
  });
});

describe("a shared server needs its access token", () => {
  let s: TestServer;
  const token = "test-token-0123456789abcdef";
  beforeAll(async () => {
    s = await startTestServer({ token });
  });
  afterAll(async () => s.close());

  it("requests without the token get 401; with it as Bearer they are answered", async () => {
    const none = await fetch(`${s.url}/api/health`);
    expect(none.status).toBe(401);
    expect(none.headers.get("www-authenticate")).toContain("Bearer");
    expect((await none.json()).error.code).toBe("token-required");
    const wrong = await fetch(`${s.url}/api/health`, { headers: { authorization: "Bearer nope" } });
    expect(wrong.status).toBe(401);
    expect((await wrong.json()).error.code).toBe("token-wrong");
    expect((await fetch(`${s.url}/api/health`, { headers: { authorization: `Bearer ${token}` } })).status).toBe(200);
  });

  it("the page's cookie carries the token for reads (links, progress streams) but never for writes", async () => {
    const cookie = `morphogauge_token=${token}`;
    expect((await fetch(`${s.url}/api/imports`, { headers: { cookie } })).status).toBe(200);
    const post = await fetch(`${s.url}/api/jobs/self-test`, { method: "POST", headers: { cookie, "content-type": "application/json" }, body: "{}" });
    expect(post.status).toBe(401);
  });

  it("tokensEqual compares whole tokens of any length", () => {
    expect(tokensEqual(token, token)).toBe(true);
    expect(tokensEqual(token.slice(0, -1), token)).toBe(false);
    expect(tokensEqual(token + "x", token)).toBe(false);
    expect(tokensEqual("", token)).toBe(false);
  });
});

describe("bounded work", () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer({ demo: true, limits: ServerLimits.parse({ maxQueue: 2 }) });
  });
  afterAll(async () => s.close());

  const post = (path: string, body: unknown) => fetch(`${s.url}${path}`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });

  it("a full queue answers 429 with a Retry-After hint", async () => {
    const started = [];
    for (let i = 0; i < 3; i++) started.push(await post("/api/jobs/self-test", { n: 100, delayMs: 50 }));
    expect(started.map((r) => r.status)).toEqual([202, 202, 202]);
    const refused = await post("/api/jobs/self-test", { n: 1, delayMs: 0 });
    expect(refused.status).toBe(429);
    expect(Number(refused.headers.get("retry-after"))).toBeGreaterThan(0);
    expect((await refused.json()).error.message).toContain("the limit is 2");
    for (const r of started) await fetch(`${s.url}/api/jobs/${((await r.json()) as { id: string }).id}`, { method: "DELETE", headers: PAGE_WRITE_HEADERS });
  });

  it("a comparison over the compute budget is refused up front, naming the limit", async () => {
    const r = await post("/api/comparisons", { channel: "glm", permutations: 1_000_000, bootstrap: 1_000_000 });
    expect(r.status).toBe(422);
    const e = (await r.json()).error;
    expect(e.code).toBe("over-compute-budget");
    expect(e.message).toContain("MORPHOGAUGE_COMPUTE_BUDGET");
  });

  it("a precision grid of 1e-9 spacing is refused up front with the grid-point limit, not a crash", async () => {
    const r = await post("/api/precision", { spacing: 1e-9, channels: ["glm"] });
    expect(r.status).toBe(422);
    const e = (await r.json()).error;
    expect(e.code).toBe("grid-too-fine");
    expect(e.message).toContain("MORPHOGAUGE_MAX_GRID_POINTS");
  });
});
