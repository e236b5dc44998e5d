import type { AddressInfo } from "node:net";
import { hostname, networkInterfaces } from "node:os";
import { createApp } from "../api/createApp.ts";
import { clientDirectory } from "../api/clientDirectory.ts";
import { generateToken } from "../api/guards/accessToken.ts";
import { isLoopbackAddress } from "../api/guards/requestHost.ts";
import { limitsFromEnv } from "../serverLimits.ts";
import { resolve } from "node:path";
import { defaultDatabasePath, defaultDemoDatabasePath } from "../../db/connection.ts";
import { DataSets } from "../services/datasets/dataSets.ts";
import { numberOption } from "./cliNumbers.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";
import { UserError } from "../userError.ts";

/** Seconds a stop may take before the process exits regardless. */
const STOP_GRACE_S = 4;

/** Names a request may use for a server bound to `host`: the address itself, and for a wildcard every address and name of this machine. */
function namesFor(host: string, extra: string[]): string[] {
  if (host !== "0.0.0.0" && host !== "::") return [host, ...extra];
  const addresses = Object.values(networkInterfaces()).flatMap((list) => (list ?? []).map((i) => i.address));
  const name = hostname();
  return [...addresses, name, `${name}.local`, ...extra];
}

export const serveCommand: Command = {
  name: "serve",
  summary: "run the lab server and its browser page",
  help: `Usage: morphogauge serve [--port 5178] [--host 127.0.0.1] [--demo] [options]

Serves the browser page and the JSON API (reference at /api/docs). It opens
your database (--db); the page shows which database is open and switches
between it, the invented demo ($MORPHOGAUGE_DEMO_DB, else ./morphogauge-demo.db,
filled the first time) and new data sets created beside your file.

  --port N          port to listen on (default 5178; 0 picks a free one)
  --host H          address to bind (default 127.0.0.1, this machine only). Any other
                    address serves colleagues on the network and needs an access token:
                    $MORPHOGAUGE_TOKEN, or one generated and printed once at start
  --allow-host NAME a host name colleagues use to reach this server (repeatable);
                    requests addressed to any other name are refused
  --demo            open the invented demo data set first (npm start does)

Limits (queue, workers, time-outs, upload sizes, compute budget) are set with
MORPHOGAUGE_* environment variables; see the README, "Safety". Ctrl+C or SIGTERM
stops running analyses (they show as interrupted and can be re-run) and exits.
${COMMON_HELP}`,
  options: { ...COMMON_OPTIONS, port: { type: "string" }, host: { type: "string" }, "allow-host": { type: "string", multiple: true }, demo: { type: "boolean", default: false } },
  async run(values, _positionals, io) {
    const port = numberOption("port", values.port as string | undefined) ?? 5178;
    if (!Number.isInteger(port) || port < 0 || port > 65535) throw new UserError("bad-option", `--port: ${port} is not a port number (0–65535)`);
    const host = (values.host as string | undefined) ?? "127.0.0.1";
    const limits = limitsFromEnv(io.env);
    const shared = !isLoopbackAddress(host);
    const envToken = io.env.MORPHOGAUGE_TOKEN && io.env.MORPHOGAUGE_TOKEN.length > 0 ? io.env.MORPHOGAUGE_TOKEN : null;
    if (envToken !== null && envToken.length < 16) throw new UserError("weak-token", "MORPHOGAUGE_TOKEN must be at least 16 characters long; leave it unset to have one generated.");
    const token = envToken ?? (shared ? generateToken() : null);
    const datasets = await DataSets.open({
      userPath: resolve(io.cwd, (values.db as string | undefined) ?? defaultDatabasePath(io.env)),
      demoPath: resolve(io.cwd, defaultDemoDatabasePath(io.env)),
      start: values.demo ? "demo" : "user",
      log: (m) => io.stderr(m + "\n"),
    });
    const path = datasets.current().path;
    const clientDir = await clientDirectory();
    const app = createApp({ datasets, clientDir, limits, token, allowedHosts: namesFor(host, (values["allow-host"] as string[] | undefined) ?? []), log: (m) => io.stderr(m + "\n") });
    const server = app.listen(port, host);
    await new Promise<void>((resolve, reject) => {
      server.once("listening", resolve);
      server.once("error", (e: NodeJS.ErrnoException) =>
        reject(e.code === "EADDRINUSE" ? new UserError("port-in-use", `port ${port} on ${host} is already in use; choose another with --port`) : e),
      );
    });
    const address = server.address() as AddressInfo;
    const url = `http://${host.includes(":") ? `[${host}]` : host}:${address.port}/`;
    if (values.json) io.stdout(JSON.stringify({ url, database: path, ...(token && !envToken ? { token } : {}) }) + "\n");
    else {
      io.stdout(`morphogauge is serving ${path}${values.demo ? " (the invented demo data)" : ""}\nOpen ${url} in a browser (Ctrl+C stops).\n`);
      if (shared) io.stdout(`This server is reachable from other machines: anyone with the address and the access token can read and change this database.\n`);
      if (token && !envToken) io.stdout(`Access token (give it to colleagues; it is shown only now): ${token}\n`);
      else if (token) io.stdout("Access token: the one in MORPHOGAUGE_TOKEN.\n");
    }
    await new Promise<void>((resolve) => {
      let stopping = false;
      const stop = (signal: string) => {
        if (stopping) {
          io.stderr(`${signal} again: exiting now\n`);
          process.exit(130);
        }
        stopping = true;
        io.stderr(`${signal}: stopping — running analyses are interrupted (they can be re-run after a restart)\n`);
        const hard = setTimeout(() => {
          io.stderr(`could not stop cleanly within ${STOP_GRACE_S} s; exiting\n`);
          process.exit(1);
        }, STOP_GRACE_S * 1000);
        server.close();
        server.closeAllConnections();
        void app
          .close()
          .catch((e: unknown) => io.stderr(`while stopping: ${(e as Error).message}\n`))
          .finally(() => {
            clearTimeout(hard);
            process.off("SIGINT", onInt);
            process.off("SIGTERM", onTerm);
            resolve();
          });
      };
      const onInt = () => stop("SIGINT");
      const onTerm = () => stop("SIGTERM");
      process.on("SIGINT", onInt);
      process.on("SIGTERM", onTerm);
    });
    datasets.close();
    // Anything still holding the event loop open (a stuck socket) must not keep a stopped server alive.
    setTimeout(() => process.exit(process.exitCode ?? 0), 1000).unref();
    return 0;
  },
};
