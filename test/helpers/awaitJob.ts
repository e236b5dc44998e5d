/** Poll a job until it ends; returns its final view. */
export async function awaitJob(url: string, jobId: string, timeoutMs = 60_000): Promise<{ status: string; result: any; error: { code: string; message: string } | null; progress: { fraction: number; stage: string } }> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const job = await (await fetch(`${url}/api/jobs/${jobId}`)).json();
    if (job.status !== "queued" && job.status !== "running") return job;
    if (Date.now() > deadline) throw new Error(`job ${jobId} still ${job.status} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** POST a JSON body and return status and parsed answer. */
export async function postJson(url: string, body: unknown): Promise<{ status: number; body: any }> {
  const r = await fetch(url, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
  return { status: r.status, body: await r.json() };
}
