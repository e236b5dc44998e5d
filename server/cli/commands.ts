import type { Command, CommandEntry } from "./command.ts";

/**
 * Every sub-command, in the order the help lists them. Each is loaded only when
 * it runs (its module pulls in the numerics, the server or the renderer it
 * needs), so `--help` and `list` start without loading the rest. The name and
 * summary here must match the command's own (a test checks).
 */
export const COMMANDS: CommandEntry[] = [
  lazy("import", "import profile exports (CSV/TSV, long or wide) into the database", async () => (await import("./importCommand.ts")).importCommand),
  lazy("list", "list stored embryos and profiles", async () => (await import("./listCommand.ts")).listCommand),
  lazy("demo", "fill the database with the invented demo data set", async () => (await import("./demoCommand.ts")).demoCommand),
  lazy("fit", "fit SDD steady-state models to stored profiles (decay length λ with its CI)", async () => (await import("./fitCommand.ts")).fitCommand),
  lazy("fits", "stored fit settings and how many profiles of each genotype have fits under each", async () => (await import("./fitsCommand.ts")).fitsCommand),
  lazy("exclude", "leave an embryo (or one of its profiles) out of group analyses, with a reason", async () => (await import("./excludeCommand.ts")).excludeCommand),
  lazy("include", "include an excluded embryo (or profile) in group analyses again", async () => (await import("./excludeCommand.ts")).includeCommand),
  lazy("exclusions", "list excluded embryos and the history of exclusions", async () => (await import("./excludeCommand.ts")).exclusionsCommand),
  lazy("precision", "positional error σ_x, boundary variability and positional information across replicate embryos", async () => (await import("./precisionCommand.ts")).precisionCommand),
  lazy("compare", "compare groups (genotypes, stages, …): λ, amplitude, boundary or spread, with CIs and tests", async () => (await import("./compareCommand.ts")).compareCommand),
  lazy("track", "follow gradients over stage or age, across a dosage series, or with embryo size", async () => (await import("./trackCommand.ts")).trackCommand),
  lazy("plan", "embryos per group needed to detect a given change in λ (or in σ_x)", async () => (await import("./planCommand.ts")).planCommand),
  lazy("dynamics", "fit D, k and the source strength to a gradient's build-up over time", async () => (await import("./dynamicsCommand.ts")).dynamicsCommand),
  lazy("frap", "fit FRAP recovery curves: D, mobile fraction and half-time", async () => (await import("./frapCommand.ts")).frapCommand),
  lazy("combine", "k, half-life, source flux and τ(x) from a FRAP D and a group's steady-state λ", async () => (await import("./combineCommand.ts")).combineCommand),
  lazy("simulate", "what if: run the build-up of a gradient forward for given D, k and flux", async () => (await import("./simulateCommand.ts")).simulateCommand),
  lazy("report", "write a self-contained HTML report with figures (PNG 300 dpi, SVG) and CSV tables", async () => (await import("./reportCommand.ts")).reportCommand),
  lazy("serve", "run the lab server and its browser page", async () => (await import("./serveCommand.ts")).serveCommand),
  lazy("backup", "write a consistent copy of the database (safe while the server runs)", async () => (await import("./backupCommand.ts")).backupCommand),
  lazy("restore", "replace the database with a backup (refuses to overwrite without --force)", async () => (await import("./restoreCommand.ts")).restoreCommand),
];

function lazy(name: string, summary: string, load: () => Promise<Command>): CommandEntry {
  return { name, summary, load };
}
