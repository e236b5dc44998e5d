import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fitGlobal } from "../server/analysis/fit/fitGlobal.ts";
import { FitOptions } from "../server/analysis/fit/fitOptions.ts";
import { fitProfile } from "../server/analysis/fit/fitProfile.ts";
import { createRandom } from "../server/analysis/random/seededRandom.ts";

/** Bench settings; the defaults are the reported configuration. */
export interface FitBenchSettings {
  profiles: number;
  points: number;
  globalEmbryos: number;
  seed: number;
  /** Print nothing (the caller prints a summary). */
  quiet: boolean;
}

const defaults: FitBenchSettings = { profiles: 1000, points: 500, globalEmbryos: 200, seed: 20240611, quiet: false };

interface SyntheticProfile {
  x: number[];
  y: number[];
  lambdaUm: number;
}

/** Seeded exponential profiles with background and 2% noise, 0.5 µm pixels. */
function syntheticProfiles(count: number, points: number, seed: number): SyntheticProfile[] {
  const random = createRandom(seed);
  const x = Array.from({ length: points }, (_, i) => 0.5 * i);
  return Array.from({ length: count }, () => {
    const lambdaUm = 20 + 60 * random.uniform();
    const amplitude = 50 + 150 * random.uniform();
    const background = 5 + 15 * random.uniform();
    const y = x.map((v) => amplitude * Math.exp(-v / lambdaUm) + background + 0.02 * amplitude * random.normal());
    return { x, y, lambdaUm };
  });
}

// Reference: scipy.optimize.curve_fit (MINPACK Levenberg–Marquardt) on the same profiles,
// timing only the fitting loop. "tight": analytic Jacobian and tolerances 1e-12, the
// configuration whose λ is compared; "default": curve_fit's defaults (finite differences).
const pythonScript = `
import json, sys, time
import numpy as np
from scipy.optimize import curve_fit
data = json.load(open(sys.argv[1]))
def f(x, A, l, B): return A * np.exp(-x / l) + B
def jac(x, A, l, B):
    e = np.exp(-x / l); return np.stack([e, A * x / l**2 * e, np.ones_like(x)], axis=1)
profiles = [(np.array(p["x"]), np.array(p["y"])) for p in data]
def start(x, y):
    b = y[-20:].mean(); a = y[:5].mean() - b
    return [a, (x[-1] - x[0]) / 5, b]
out = {}
for name, kw in [("tight", dict(jac=jac, xtol=1e-12, ftol=1e-12, gtol=1e-12)), ("default", dict())]:
    lambdas = []; failures = 0
    t0 = time.perf_counter()
    for x, y in profiles:
        try:
            popt, _ = curve_fit(f, x, y, p0=start(x, y), method="lm", maxfev=10000, **kw)
            lambdas.append(float(popt[1]))
        except RuntimeError:
            lambdas.append(None); failures += 1
    out[name] = {"seconds": time.perf_counter() - t0, "lambdas": lambdas, "failures": failures}
json.dump(out, sys.stdout)
`;

/**
 * Time our steady-state fitter against scipy.optimize.curve_fit on the same
 * seeded 500-point profiles, compare their decay lengths, and time a global
 * fit over many embryos. Prints a table; returns the numbers.
 */
export function runFitBench(settings: Partial<FitBenchSettings> = {}) {
  const s = { ...defaults, ...settings };
  const profiles = syntheticProfiles(s.profiles, s.points, s.seed);
  const options = FitOptions.parse({});

  // JavaScript is compiled while it runs: the first few thousand fits of a
  // process are slower. Time one pass over a separate warm-up set (reported
  // as "cold"), run it three more times, then time the measured set (as
  // scipy's MINPACK is compiled ahead of time).
  const warmUp = syntheticProfiles(s.profiles, s.points, s.seed + 2);
  const cold0 = performance.now();
  for (const p of warmUp) fitProfile(p.x, p.y, options);
  const coldSeconds = (performance.now() - cold0) / 1000;
  for (let pass = 0; pass < 3; pass++) for (const p of warmUp) fitProfile(p.x, p.y, options);
  const ours: number[] = [];
  let oursFailed = 0;
  const t0 = performance.now();
  for (const p of profiles) {
    const fit = fitProfile(p.x, p.y, options);
    if (fit.ok) ours.push(fit.parameters.lambdaUm.value);
    else {
      ours.push(NaN);
      oursFailed++;
    }
  }
  const oursSeconds = (performance.now() - t0) / 1000;

  const dir = mkdtempSync(join(tmpdir(), "morphogauge-fitbench-"));
  let reference: Record<"tight" | "default", { seconds: number; lambdas: (number | null)[]; failures: number }>;
  try {
    const dataFile = join(dir, "profiles.json");
    const scriptFile = join(dir, "reference.py");
    writeFileSync(dataFile, JSON.stringify(profiles.map(({ x, y }) => ({ x, y }))));
    writeFileSync(scriptFile, pythonScript);
    const proc = spawnSync("python3", [scriptFile, dataFile], { encoding: "utf8", maxBuffer: 64 * 1024 * 1024 });
    if (proc.status !== 0) throw new Error(`python3 reference failed:\n${proc.stderr}`);
    reference = JSON.parse(proc.stdout);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }

  let worstDisagreement = 0;
  let compared = 0;
  ours.forEach((l, i) => {
    const r = reference.tight.lambdas[i];
    if (!Number.isFinite(l) || r === null) return;
    compared++;
    worstDisagreement = Math.max(worstDisagreement, Math.abs(l - r) / Math.abs(r));
  });

  // Global fit: one shared λ over many embryos with their own amplitude and background.
  const shared = syntheticShared(s.globalEmbryos, s.points, s.seed + 1);
  fitGlobal(shared.profiles.slice(0, 10), options);
  const globalTimes: number[] = [];
  let globalLambda = NaN;
  for (let r = 0; r < 3; r++) {
    const g0 = performance.now();
    const g = fitGlobal(shared.profiles, options);
    globalTimes.push((performance.now() - g0) / 1000);
    if (g.ok) globalLambda = g.shared.lambdaUm.value;
  }

  const perFit = (seconds: number) => (1e6 * seconds) / s.profiles;
  const result = {
    profiles: s.profiles,
    points: s.points,
    oursMicroseconds: perFit(oursSeconds),
    oursColdMicroseconds: perFit(coldSeconds),
    scipyTightMicroseconds: perFit(reference.tight.seconds),
    scipyDefaultMicroseconds: perFit(reference.default.seconds),
    speedupTight: reference.tight.seconds / oursSeconds,
    speedupDefault: reference.default.seconds / oursSeconds,
    worstRelativeLambdaDisagreement: worstDisagreement,
    compared,
    oursFailed,
    scipyFailed: reference.tight.failures,
    globalEmbryos: s.globalEmbryos,
    globalSeconds: Math.min(...globalTimes),
    globalLambdaUm: globalLambda,
    globalTrueLambdaUm: shared.lambdaUm,
  };

  if (s.quiet) return result;
  const row = (label: string, value: string, target = "") => `  ${label.padEnd(46)} ${value.padStart(14)}  ${target}`;
  console.log(`\nSteady-state fit: ${s.profiles} seeded exponential profiles × ${s.points} points`);
  console.log(row("", "value", "target"));
  console.log(row("ours, per fit (after JIT warm-up)", `${result.oursMicroseconds.toFixed(1)} µs`));
  console.log(row("ours, per fit (first 1000 of the process, cold)", `${result.oursColdMicroseconds.toFixed(1)} µs`));
  console.log(row("scipy curve_fit (analytic J, tol 1e-12), per fit", `${result.scipyTightMicroseconds.toFixed(1)} µs`));
  console.log(row("scipy curve_fit (defaults), per fit", `${result.scipyDefaultMicroseconds.toFixed(1)} µs`));
  console.log(row("speed-up vs scipy (analytic J, tol 1e-12)", `${result.speedupTight.toFixed(1)}×`, "≥ 5×"));
  console.log(row("speed-up vs scipy (defaults)", `${result.speedupDefault.toFixed(1)}×`, "≥ 5×"));
  console.log(row(`largest relative λ disagreement (${compared} fits)`, result.worstRelativeLambdaDisagreement.toExponential(2), "≤ 1e-6"));
  console.log(row("fits without a result (ours / scipy)", `${oursFailed} / ${reference.tight.failures}`));
  console.log(`\nGlobal fit: ${s.globalEmbryos} embryos × ${s.points} points, shared λ`);
  console.log(row("time (best of 3)", `${(1000 * result.globalSeconds).toFixed(1)} ms`));
  console.log(row("shared λ (true value)", `${globalLambda.toFixed(3)} µm (${shared.lambdaUm} µm)`));
  return result;
}

/** Replicates sharing one λ, each with its own amplitude, background and noise. */
function syntheticShared(count: number, points: number, seed: number) {
  const random = createRandom(seed);
  const lambdaUm = 45;
  const x = Array.from({ length: points }, (_, i) => 0.5 * i);
  const profiles = Array.from({ length: count }, () => {
    const amplitude = 50 + 150 * random.uniform();
    const background = 5 + 15 * random.uniform();
    return { x, y: x.map((v) => amplitude * Math.exp(-v / lambdaUm) + background + 0.02 * amplitude * random.normal()) };
  });
  return { lambdaUm, profiles };
}
