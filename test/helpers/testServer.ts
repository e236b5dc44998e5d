import type { AddressInfo } from "node:net";
import type { Server } from "node:http";
import { openDatabaseSync, type Db } from "../../db/connection.ts";
import { createApp } from "../../server/api/createApp.ts";
import type { DataSets } from "../../server/services/datasets/dataSets.ts";
import { loadDemoData } from "../../server/services/demoData.ts";

export interface TestServer {
  url: string;
  db: Db;
  logs: string[];
  close(): Promise<void>;
}

/**
 * The app on an ephemeral port of 127.0.0.1 with an in-memory database (optionally holding the demo data),
 * or with switchable data sets (`db` is then the one open at the start).
 */
export async function startTestServer(options: { demo?: boolean; clientDir?: string; datasets?: DataSets } = {}): Promise<TestServer> {
  const db = options.datasets?.db ?? openDatabaseSync(":memory:");
  if (options.demo && !options.datasets) loadDemoData(db);
  const logs: string[] = [];
  const app = createApp(options.datasets ? { datasets: options.datasets, clientDir: options.clientDir, log: (m) => logs.push(m) } : { db, clientDir: options.clientDir, log: (m) => logs.push(m) });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, "127.0.0.1", () => resolve(s));
  });
  // An idle kept-alive socket must not be closed by the server while a test's next request is on its
  // way: keep idle sockets longer than any pause between requests, and close them all at the end.
  server.keepAliveTimeout = 120_000;
  server.headersTimeout = 125_000;
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    db,
    logs,
    async close() {
      await app.jobs.close();
      const closed = new Promise((r) => server.close(r));
      server.closeAllConnections();
      await closed;
      if (options.datasets) options.datasets.close();
      else db.close();
    },
  };
}

/** multipart/form-data body with files given as name → text. */
export function uploadForm(files: Record<string, string>, fields: Record<string, string> = {}, metaFile?: [string, string]): FormData {
  const form = new FormData();
  for (const [name, text] of Object.entries(files)) form.append("files", new Blob([text]), name);
  if (metaFile) form.append("meta", new Blob([metaFile[1]]), metaFile[0]);
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  return form;
}
