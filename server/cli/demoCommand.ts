import { defaultDemoDatabasePath } from "../../db/connection.ts";
import { loadDemoData } from "../services/demoData.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";
import { openCliDatabase } from "./openCliDatabase.ts";

export const demoCommand: Command = {
  name: "demo",
  summary: "fill the database with the invented demo data set",
  help: `Usage: morphogauge demo [--db PATH] [options]

Imports the demo data (fixtures/): glimmerin profiles of a fictional lab,
three genotypes plus a dosage series, invented for trying the tool out.
The demo lives in a database of its own: $MORPHOGAUGE_DEMO_DB, else
./morphogauge-demo.db (or the file named by --db, which must not hold your
own imports), so its embryos never join your groups. Running it twice adds
nothing the second time. Then: export MORPHOGAUGE_DB=morphogauge-demo.db,
or pass --db morphogauge-demo.db to the other commands.

${COMMON_HELP.replace("database file (default: $MORPHOGAUGE_DB or ./morphogauge.db)", "database file (default: $MORPHOGAUGE_DEMO_DB or ./morphogauge-demo.db)")}`,
  options: { ...COMMON_OPTIONS },
  async run(values, _positionals, io) {
    const { db, path } = await openCliDatabase((values.db as string | undefined) ?? defaultDemoDatabasePath(io.env), io);
    try {
      const reports = loadDemoData(db);
      if (values.json) io.stdout(JSON.stringify({ database: path, files: reports }, null, 2) + "\n");
      else {
        for (const r of reports) io.stdout(`${r.status === "rejected" ? "✗" : "✓"} ${r.file}: ${r.status === "rejected" ? r.error.message : r.message}\n`);
        io.stdout(`The invented demo data is in ${path}, a database of its own. Next: morphogauge list --db ${path}\n`);
      }
      return reports.some((r) => r.status === "rejected") ? 1 : 0;
    } finally {
      db.close();
    }
  },
};
