import { loadDemoData, loadDynamicsDemo } from "../services/demoData.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";
import { openCliDatabase } from "./openCliDatabase.ts";

export const demoCommand: Command = {
  name: "demo",
  summary: "fill the database with the invented demo data set",
  help: `Usage: morphogauge demo [options]

Imports the demo data (fixtures/): glimmerin profiles of a fictional lab,
three genotypes plus a dosage series, and a build-up time course of a live
reporter (channel glm-gfp; FRAP curves of it are in fixtures/glimmerin_frap_cell*.csv),
invented for trying the tool out.
Running it twice adds nothing the second time.

${COMMON_HELP}`,
  options: { ...COMMON_OPTIONS },
  async run(values, _positionals, io) {
    const { db, path } = await openCliDatabase(values.db as string | undefined, io);
    try {
      const reports = [...loadDemoData(db), ...loadDynamicsDemo(db)];
      if (values.json) io.stdout(JSON.stringify({ database: path, files: reports }, null, 2) + "\n");
      else {
        for (const r of reports) io.stdout(`${r.status === "rejected" ? "✗" : "✓"} ${r.file}: ${r.status === "rejected" ? r.error.message : r.message}\n`);
        io.stdout(`Demo data is in ${path}. Next: morphogauge list --db ${path}\n`);
      }
      return reports.some((r) => r.status === "rejected") ? 1 : 0;
    } finally {
      db.close();
    }
  },
};
