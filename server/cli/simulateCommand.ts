import { SimulateRequest } from "../services/dynamics/dynamicsRequests.ts";
import { simulateBuildUp } from "../services/dynamics/simulateService.ts";
import { UserError } from "../userError.ts";
import { numberOption, rangeOption } from "./cliNumbers.ts";
import { COMMON_HELP, COMMON_OPTIONS, type Command } from "./command.ts";
import { durationOption, numberListOption } from "./dynamicsOptions.ts";
import { significant } from "./formatEstimate.ts";
import { openCliDatabase } from "./openCliDatabase.ts";
import { zodToUserError } from "./zodToUserError.ts";

export const simulateCommand: Command = {
  name: "simulate",
  summary: "what if: run the build-up of a gradient forward for given D, k and flux",
  help: `Usage: morphogauge simulate --D UM2_PER_S --k PER_S --length UM --until DURATION [options]

Solves ∂c/∂t = D c″ − k c from c = 0 with an influx at x = 0 (or production in a
source region) and a closed far end, and prints profiles over time, λ = √(D/k),
the half-life and the local accumulation time τ(x).

  --D D                 diffusion coefficient (µm²/s)
  --k K                 degradation rate (1/s)
  --flux J              influx at x = 0 (a.u.·µm/s; default 1)
  --length UM           domain length (µm)
  --until T             how long to run: 3h, 90min, 600s
  --source A:B          production in A ≤ x ≤ B µm instead of an influx (same total, closed end at 0)
  --profiles N          profiles to report, evenly spaced in time (default 6)
  --cells N             finite volumes (default 200)
  --tau-at X,Y          positions (µm) for τ(x)
${COMMON_HELP}`,
  options: {
    ...COMMON_OPTIONS,
    D: { type: "string" },
    k: { type: "string" },
    flux: { type: "string" },
    length: { type: "string" },
    until: { type: "string" },
    source: { type: "string" },
    profiles: { type: "string" },
    cells: { type: "string" },
    "tau-at": { type: "string" },
  },
  async run(values, _positionals, io) {
    for (const required of ["D", "k", "length", "until"])
      if (values[required] === undefined) throw new UserError("bad-option", `--${required} is required (see morphogauge simulate --help)`);
    const source = rangeOption("source", values.source as string | undefined);
    if (source && (source.min === undefined || source.max === undefined)) throw new UserError("bad-option", "--source: give both ends, e.g. 0:20 (µm)");
    const parsed = SimulateRequest.safeParse({
      diffusionUm2PerS: numberOption("D", values.D as string),
      degradationPerS: numberOption("k", values.k as string),
      flux: numberOption("flux", values.flux as string | undefined),
      lengthUm: numberOption("length", values.length as string),
      untilS: durationOption("until", values.until as string),
      source: source ? { fromUm: source.min, toUm: source.max } : undefined,
      profiles: numberOption("profiles", values.profiles as string | undefined),
      cells: numberOption("cells", values.cells as string | undefined),
      accumulationPositionsUm: numberListOption("tau-at", values["tau-at"] as string | undefined),
    });
    if (!parsed.success) throw zodToUserError(parsed.error, { diffusionUm2PerS: "D", degradationPerS: "k", lengthUm: "length", untilS: "until", accumulationPositionsUm: "tau-at" });
    const { db } = await openCliDatabase(values.db as string | undefined, io);
    try {
      const out = simulateBuildUp(parsed.data, db);
      if (values.json) {
        io.stdout(JSON.stringify(out, null, 2) + "\n");
        return 0;
      }
      io.stdout(`Simulation ${out.analysis_id}: D = ${significant(out.D_um2_per_s!.value)} µm²/s, k = ${significant(out.k_per_s!.value)} 1/s → λ = ${significant(out.lambda_um!.value)} µm, half-life ${significant(out.half_life_s!.value / 60)} min\n`);
      const picks = [0, 0.25, 0.5, 0.75].map((f) => Math.min(out.positions_um.length - 1, Math.round(f * (out.positions_um.length - 1))));
      io.stdout(`  time            ${picks.map((i) => `c(${significant(out.positions_um[i])} µm)`.padStart(14)).join("")}\n`);
      for (const p of out.profiles) io.stdout(`  ${`${significant(p.t_s / 60)} min`.padEnd(16)}${picks.map((i) => significant(p.values[i]).padStart(14)).join("")}\n`);
      io.stdout(`  ${"steady state".padEnd(16)}${picks.map((i) => significant(out.steady_state[i]).padStart(14)).join("")}\n`);
      io.stdout("  local accumulation time τ(x) and the fraction of steady state reached at the end:\n");
      out.accumulation_time_s.forEach((t, i) => io.stdout(`    x = ${significant(t.x_um)} µm: τ = ${significant(t.value / 60)} min, ${(100 * out.fraction_of_steady_state[i].fraction).toFixed(1)}% reached\n`));
      io.stdout(`  ${out.note}\n`);
      return 0;
    } finally {
      db.close();
    }
  },
};
