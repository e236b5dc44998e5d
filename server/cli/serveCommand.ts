import type { AddressInfo } from "node:net";
import { createApp } from "../api/createApp.ts";
import { buildClient } from "../api/buildClient.ts";
import { resolve } from "node:path";
import { defaultDatabasePath, defaultDemoDatabasePath } from "../../db/connection.ts";
import { DataSets } from "../services/datasets/dataSets.ts";
import { numberOption } from "./cliNumbers.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";
import { UserError } from "../userError.ts";

export const serveCommand: Command = {
  name: "serve",
  summary: "run the lab server and its browser page",
  help: `Usage: morphogauge serve [--port 5178] [--host 127.0.0.1] [--demo] [options]

Serves the browser page and the JSON API (reference at /api/docs). It opens
your database (--db); the page shows which database is open and switches
between it, the invented demo ($MORPHOGAUGE_DEMO_DB, else ./morphogauge-demo.db,
filled the first time) and new data sets created beside your file.

  --port N       port to listen on (default 5178; 0 picks a free one)
  --host H       address to bind (default 127.0.0.1, this machine only)
  --demo         open the invented demo data set first (npm start does)
${COMMON_HELP}`,
  options: { ...COMMON_OPTIONS, port: { type: "string" }, host: { type: "string" }, demo: { type: "boolean", default: false } },
  async run(values, _positionals, io) {
    const port = numberOption("port", values.port as string | undefined) ?? 5178;
    if (!Number.isInteger(port) || port < 0 || port > 65535) throw new UserError("bad-option", `--port: ${port} is not a port number (0–65535)`);
    const host = (values.host as string | undefined) ?? "127.0.0.1";
    const datasets = await DataSets.open({
      userPath: resolve(io.cwd, (values.db as string | undefined) ?? defaultDatabasePath(io.env)),
      demoPath: resolve(io.cwd, defaultDemoDatabasePath(io.env)),
      start: values.demo ? "demo" : "user",
      log: (m) => io.stderr(m + "\n"),
    });
    const path = datasets.current().path;
    const clientDir = await buildClient();
    const app = createApp({ datasets, clientDir, log: (m) => io.stderr(m + "\n") });
    const server = app.listen(port, host);
    await new Promise<void>((resolve, reject) => {
      server.once("listening", resolve);
      server.once("error", (e: NodeJS.ErrnoException) =>
        reject(e.code === "EADDRINUSE" ? new UserError("port-in-use", `port ${port} on ${host} is already in use; choose another with --port`) : e),
      );
    });
    const address = server.address() as AddressInfo;
    const url = `http://${host.includes(":") ? `[${host}]` : host}:${address.port}/`;
    if (values.json) io.stdout(JSON.stringify({ url, database: path }) + "\n");
    else io.stdout(`morphogauge is serving ${path}${values.demo ? " (the invented demo data)" : ""}\nOpen ${url} in a browser (Ctrl+C stops).\n`);
    await new Promise<void>((resolve) => {
      const stop = () => server.close(() => resolve());
      process.once("SIGINT", stop);
      process.once("SIGTERM", stop);
    });
    await app.jobs.close();
    datasets.close();
    return 0;
  },
};
