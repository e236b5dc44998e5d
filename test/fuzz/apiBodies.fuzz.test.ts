import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ServerLimits } from "../../server/serverLimits.ts";
import { PAGE_WRITE_HEADERS, startTestServer, type TestServer } from "../helpers/testServer.ts";
import { CASE_TIME_LIMIT_MS, FUZZ_RUNS, FUZZ_SEED } from "./fuzzSettings.ts";

// Property-based checks of every API body: random JSON never gets a 500, always a readable answer, and a refusal changes nothing (common practice, no source).

const JSON_ROUTES = ["/api/fits", "/api/precision", "/api/comparisons", "/api/tracking", "/api/plans", "/api/jobs/self-test"];
const HOSTILE = ["<script>alert(1)</script>", "'; DROP TABLE fits; --", "__proto__", "constructor", "🐟", "a".repeat(5000)];

const scalar = fc.oneof(
  fc.integer(),
  fc.double(),
  fc.constantFrom(0, -1, 1e308, -1e-320, 1e-9, 100_000, 1_000_000, Number.MAX_SAFE_INTEGER),
  fc.boolean(),
  fc.constant(null),
  fc.string({ maxLength: 30 }),
  fc.constantFrom(...HOSTILE),
);
/** Bodies shaped like the real requests (known keys, wild values) as well as arbitrary JSON. */
const body = fc.oneof(
  fc.jsonValue(),
  fc.record(
    {
      selection: fc.oneof(fc.jsonValue(), fc.record({ genotype: scalar, channel: scalar, profileIds: fc.array(fc.oneof(fc.integer(), scalar), { maxLength: 50 }), metadata: fc.dictionary(fc.string({ maxLength: 8 }), scalar) }, { requiredKeys: [] })),
      models: fc.oneof(fc.array(fc.constantFrom("exponential", "all", "power", "nonsense"), { maxLength: 4 }), scalar),
      global: scalar,
      channel: fc.constantFrom("glm", "vellin", "nope"),
      channels: fc.oneof(fc.constant(["glm"]), fc.array(scalar, { maxLength: 3 })),
      spacing: scalar,
      range: fc.oneof(fc.tuple(scalar, scalar), scalar),
      bootstrap: scalar,
      permutations: scalar,
      simulations: scalar,
      permutationSimulations: scalar,
      effect: scalar,
      over: fc.constantFrom("stage", "age", "dosage", "length", "nope"),
      metric: fc.constantFrom("lambda", "amplitude", "boundary", "sigma_x", "nope"),
      n: scalar,
      delayMs: scalar,
      seed: scalar,
    },
    { requiredKeys: [] },
  ),
);

/** Rows written by the server's one connection so far: unchanged means nothing was stored (cheaper than hashing the demo data each case). */
const writes = (s: TestServer) => (s.db.prepare("SELECT total_changes() AS n").get() as { n: number }).n;

describe(`API bodies under random input (${FUZZ_RUNS} cases per route, seed ${FUZZ_SEED})`, () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer({ demo: true, limits: ServerLimits.parse({ maxQueue: 1000 }) });
  });
  afterAll(async () => s.close());

  it.each(JSON_ROUTES)("POST %s: no 500, a readable answer, and nothing stored on a refusal", async (route) => {
    await fc.assert(
      fc.asyncProperty(body, async (b) => {
        const before = writes(s);
        const t0 = performance.now();
        const r = await fetch(`${s.url}${route}`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(b) });
        const answer = (await r.json()) as { id?: string; error?: { message: string } };
        expect(performance.now() - t0).toBeLessThan(CASE_TIME_LIMIT_MS);
        expect(r.status).toBeLessThan(500);
        if (r.status >= 400) {
          expect(answer.error?.message.length).toBeGreaterThan(5);
          expect(answer.error!.message.length).toBeLessThan(3000);
          expect(writes(s)).toBe(before);
        } else {
          expect(r.status).toBe(202);
          // Accepted: stop it again, so the queue stays short.
          await fetch(`${s.url}/api/jobs/${answer.id}`, { method: "DELETE", headers: PAGE_WRITE_HEADERS });
        }
      }),
      { numRuns: FUZZ_RUNS, seed: FUZZ_SEED },
    );
  }, 600_000);

  it("malformed JSON, wrong content types and random query strings never get a 500", async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom(...JSON_ROUTES),
        fc.string({ maxLength: 200 }),
        fc.constantFrom("application/json", "text/plain", "application/x-www-form-urlencoded"),
        fc.dictionary(fc.constantFrom("genotype", "channel", "model", "profileId", "limit", "offset", "kind", "x"), fc.oneof(fc.string({ maxLength: 20 }), fc.constantFrom("-1", "1e999", "NaN", "0x10"))),
        async (route, text, type, query) => {
          const before = writes(s);
          const r = await fetch(`${s.url}${route}`, { method: "POST", headers: { "content-type": type, ...PAGE_WRITE_HEADERS }, body: text });
          expect(r.status).toBeLessThan(500);
          if (r.status >= 400) expect(writes(s)).toBe(before);
          else await fetch(`${s.url}/api/jobs/${((await r.json()) as { id: string }).id}`, { method: "DELETE", headers: PAGE_WRITE_HEADERS });
          const q = new URLSearchParams(query).toString();
          for (const path of ["/api/profiles", "/api/fits", "/api/analyses", "/api/imports"]) expect((await fetch(`${s.url}${path}?${q}`)).status).toBeLessThan(500);
        },
      ),
      { numRuns: FUZZ_RUNS, seed: FUZZ_SEED + 7 },
    );
  }, 600_000);

  it("random uploads to the preview never get a 500 and store nothing", async () => {
    await fc.assert(
      fc.asyncProperty(fc.uint8Array({ maxLength: 5000 }), fc.string({ maxLength: 40 }), async (bytes, name) => {
        const before = writes(s);
        const form = new FormData();
        form.append("files", new Blob([bytes]), name || "x.csv");
        const r = await fetch(`${s.url}/api/imports/preview`, { method: "POST", headers: PAGE_WRITE_HEADERS, body: form });
        expect(r.status).toBeLessThan(500);
        expect(writes(s)).toBe(before);
      }),
      { numRuns: FUZZ_RUNS, seed: FUZZ_SEED + 9 },
    );
  }, 600_000);
});
