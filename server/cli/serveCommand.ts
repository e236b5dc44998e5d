import type { AddressInfo } from "node:net";
import { createApp } from "../api/createApp.ts";
import { clientDirectory } from "../api/clientDirectory.ts";
import { isEmpty, loadDemoData } from "../services/demoData.ts";
import { numberOption } from "./cliNumbers.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";
import { openCliDatabase } from "./openCliDatabase.ts";
import { UserError } from "../userError.ts";

export const serveCommand: Command = {
  name: "serve",
  summary: "run the lab server and its browser page",
  help: `Usage: morphogauge serve [--port 5178] [--host 127.0.0.1] [--demo] [options]

Serves the browser page and the JSON API (reference at /api/docs).

  --port N       port to listen on (default 5178; 0 picks a free one)
  --host H       address to bind (default 127.0.0.1, this machine only)
  --demo         load the demo data first if the database is empty
${COMMON_HELP}`,
  options: { ...COMMON_OPTIONS, port: { type: "string" }, host: { type: "string" }, demo: { type: "boolean", default: false } },
  async run(values, _positionals, io) {
    const port = numberOption("port", values.port as string | undefined) ?? 5178;
    if (!Number.isInteger(port) || port < 0 || port > 65535) throw new UserError("bad-option", `--port: ${port} is not a port number (0–65535)`);
    const host = (values.host as string | undefined) ?? "127.0.0.1";
    const { db, path, created } = await openCliDatabase(values.db as string | undefined, io);
    if (values.demo && isEmpty(db)) {
      const reports = loadDemoData(db);
      io.stderr(`${created ? "created" : "filled"} ${path} with the demo data (${reports.filter((r) => r.status === "imported").length} files)\n`);
    }
    const clientDir = await clientDirectory();
    const app = createApp({ db, clientDir, log: (m) => io.stderr(m + "\n") });
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
    else io.stdout(`morphogauge is serving ${path}\nOpen ${url} in a browser (Ctrl+C stops).\n`);
    await new Promise<void>((resolve) => {
      const stop = () => server.close(() => resolve());
      process.once("SIGINT", stop);
      process.once("SIGTERM", stop);
    });
    db.close();
    return 0;
  },
};
