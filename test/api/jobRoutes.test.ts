import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PAGE_WRITE_HEADERS, startTestServer, type TestServer } from "../helpers/testServer.ts";

// Background jobs: progress, streaming, cancellation, and answering other requests meanwhile (common practice, no source).
describe("job API", () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer();
  });
  afterAll(async () => s.close());

  const start = async (n: number, delayMs: number) =>
    (await fetch(`${s.url}/api/jobs/self-test`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ n, delayMs }) })).json();

  it("a job runs in a worker thread, streams progress as server-sent events, and ends done with its result", async () => {
    const job = await start(5, 30);
    expect(job.status).toMatch(/queued|running/);
    const res = await fetch(`${s.url}/api/jobs/${job.id}/events`);
    expect(res.headers.get("content-type")).toContain("text/event-stream");
    const text = await res.text();
    const events = text.split("\n\n").filter(Boolean).map((e) => JSON.parse(e.replace(/^data: /, "")));
    expect(events.at(-1)).toMatchObject({ status: "done", result: { counted: 5 }, progress: { fraction: 1 } });
    expect(events.some((e) => e.status === "running" && e.progress.fraction > 0 && e.progress.fraction < 1)).toBe(true);
  });

  it("the server answers other requests while a job runs, and a running job can be cancelled", async () => {
    const job = await start(200, 20);
    await new Promise((r) => setTimeout(r, 300));
    const t0 = performance.now();
    expect((await fetch(`${s.url}/api/health`)).status).toBe(200);
    expect(performance.now() - t0).toBeLessThan(1000);
    const cancelled = await (await fetch(`${s.url}/api/jobs/${job.id}`, { method: "DELETE", headers: PAGE_WRITE_HEADERS })).json();
    expect(cancelled.status).toBe("cancelled");
    expect((await (await fetch(`${s.url}/api/jobs/${job.id}`)).json()).status).toBe("cancelled");
  });

  it("unknown and malformed job ids are 404 and 400", async () => {
    expect((await fetch(`${s.url}/api/jobs/00000000-0000-4000-8000-000000000000`)).status).toBe(404);
    expect((await fetch(`${s.url}/api/jobs/not-a-uuid`)).status).toBe(400);
  });
});
