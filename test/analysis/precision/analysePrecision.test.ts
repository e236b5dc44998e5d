import { describe, expect, it } from "vitest";
import { analysePrecision } from "../../../server/analysis/precision/analysePrecision.ts";
import { PrecisionOptions } from "../../../server/analysis/precision/precisionOptions.ts";
import { exponentialGroup, nonFinitePaths } from "./simulateGradients.ts";

const quick = { bootstrap: { resamples: 60 }, information: { extrapolate: false } } as const;

describe("PrecisionOptions", () => {
  it("is the single home of the defaults", () => {
    // common practice, no source: defaults chosen for this tool (1,000 resamples as in Efron & Tibshirani 1993, ch. 13).
    const s = PrecisionOptions.parse({});
    expect(s.coords).toBe("absolute");
    expect(s.normalisation).toBe("none");
    expect(s.flip).toBe("none");
    expect(s.derivative).toEqual({ method: "savitzky-golay", windowPoints: null, polynomialOrder: 3 });
    expect(s.bootstrap).toEqual({ resamples: 1000, seed: 1, slowResamples: 200 });
    expect(s.mask).toEqual({ minSlopeSnr: 3, maxSigmaFraction: 0.25 });
    expect(s.outlierThreshold).toBe(3.5);
  });

  it("reports invalid options with the path and the rule", () => {
    // common practice, no source.
    const even = PrecisionOptions.safeParse({ derivative: { windowPoints: 8 } });
    expect(even.success).toBe(false);
    expect(even.error!.issues[0]).toMatchObject({ path: ["derivative", "windowPoints"], message: "windowPoints must be odd" });
    const model = PrecisionOptions.safeParse({ derivative: { method: "model" } });
    expect(model.error!.issues[0]).toMatchObject({ path: ["derivative", "slopeModel"] });
    const region = PrecisionOptions.safeParse({ region: [300, 100] });
    expect(region.error!.issues[0].message).toBe("interval must have from < to");
  });
});

describe("analysePrecision", () => {
  const group = exponentialGroup({ embryos: 40, lambdaUm: 80, cv: 0.12, noise: "pointwise", seed: 71 });

  it("returns a result free of NaN and Infinity, even with masked positions, a position off the grid and never-crossing embryos", () => {
    // common practice, no source: results carry null where a value is unavailable.
    const flat = exponentialGroup({ embryos: 30, lambdaUm: 2000, cv: 0.3, noise: "pointwise", seed: 72 });
    const r = analysePrecision(flat, { ...quick, positions: [50, 1000], boundary: { threshold: 990 }, information: { kernelDensity: true, extrapolate: true }, bootstrap: { resamples: 30, slowResamples: 10 } });
    expect(nonFinitePaths(r)).toEqual([]);
    expect(r.sigmaXAtPositions[1].sigmaX).toBeNull();
    expect(r.mask.counts["shallow-slope"] + r.mask.counts.imprecise).toBeGreaterThan(0);
    const r2 = analysePrecision(group, { ...quick, normalisation: "scale-offset", flip: "auto", coords: "relative", positions: [0.5] });
    expect(nonFinitePaths(r2)).toEqual([]);
    expect(JSON.parse(JSON.stringify(r2))).toEqual(r2);
  });

  it("reports every setting used, including the grid chosen from the data and the derivative window", () => {
    // common practice, no source: default grid = median native spacing over the range covered by all profiles.
    const r = analysePrecision(group, quick);
    expect(r.settings.grid).toEqual({ spacing: 2, spacingSource: "median native spacing", range: [0, 400], rangeSource: "covered by all profiles", points: 201 });
    expect(r.settings.derivative.method).toBe("savitzky-golay");
    expect(r.settings.derivative.windowPoints).toBe(13);
    expect(r.settings.derivative.description).toContain("13-point window, order 3");
    expect(r.settings.bootstrap).toEqual({ resamples: 60, seed: 1, slowResamples: 200 });
    expect(r.normalisation.method).toBe("none");
    expect(r.nEmbryos).toBe(40);
    expect(r.coords).toBe("absolute");
  });

  it("summarises σ_x over the stated default region: the headline is within 5% of λ·CV, its interval contains it, and values at chosen positions interpolate the curve", () => {
    // Source: σ_x = λ·CV for this simulation (METHODS.md §4 [derived]); λ = 80 µm, CV = 0.12 → 9.6 µm.
    const r = analysePrecision(group, { ...quick, positions: [101, 200] });
    const region = r.positionalInformation.region;
    // common practice, no source: the default region is the covered span 0–400 µm trimmed by 10% at each end.
    expect([region.from, region.to, region.source]).toEqual([40, 360, "default"]);
    const s = r.sigmaXSummary!;
    expect(s.method).toBe("geometric mean over the region");
    expect(Math.abs(s.value / (80 * 0.12) - 1)).toBeLessThan(0.05);
    expect(s.ci95![0]).toBeLessThan(s.value);
    expect(s.ci95![1]).toBeGreaterThan(s.value);
    expect(s.fractionOfLength!.value).toBeCloseTo(s.value / 400, 12);
    const at101 = r.sigmaXAtPositions[0].sigmaX!.value;
    const k100 = r.gridX.indexOf(100);
    expect(at101).toBeCloseTo(0.5 * ((r.sigmaX[k100] as number) + (r.sigmaX[k100 + 1] as number)), 12);
  });

  it("is reproducible from its seed, and a different seed changes only the bootstrap intervals", () => {
    // common practice, no source.
    const a = analysePrecision(group, { ...quick, bootstrap: { resamples: 40, seed: 5 } });
    const b = analysePrecision(group, { ...quick, bootstrap: { resamples: 40, seed: 5 } });
    const c = analysePrecision(group, { ...quick, bootstrap: { resamples: 40, seed: 6 } });
    expect(b).toEqual(a);
    expect(c.sigmaX).toEqual(a.sigmaX);
    expect(c.sigmaXCi95).not.toEqual(a.sigmaXCi95);
  });

  it("reports progress from 0 to 1 through the named stages", () => {
    // common practice, no source.
    const calls: [number, string][] = [];
    analysePrecision(group, { ...quick, bootstrap: { resamples: 200 }, onProgress: (f, stage) => calls.push([f, stage]) });
    const fractions = calls.map(([f]) => f);
    expect(fractions[0]).toBe(0);
    expect(calls[calls.length - 1]).toEqual([1, "done"]);
    fractions.slice(1).forEach((f, i) => expect(f).toBeGreaterThanOrEqual(fractions[i]));
    expect(calls.filter(([, s]) => s === "bootstrap").length).toBeGreaterThan(50);
  });

  it("flip 'auto' reads a reversed embryo from the other end and says so", () => {
    // common practice, no source.
    const reversed = group.map((p, i) => (i === 3 ? { ...p, intensity: Array.from(p.intensity).reverse() } : p));
    const kept = analysePrecision(reversed, quick);
    expect(kept.orientation.flagged).toEqual([group[3].embryo]);
    expect(kept.orientation.flipped).toEqual([]);
    expect(kept.warnings.map((w) => w.code)).toContain("orientation-flagged");
    const flipped = analysePrecision(reversed, { ...quick, flip: "auto" });
    expect(flipped.orientation.flipped).toEqual([group[3].embryo]);
    expect(flipped.sigmaX).toEqual(analysePrecision(group, quick).sigmaX.map((v) => (v === null ? null : expect.closeTo(v, 9))));
  });

  it("flags a planted outlier among the caller's per-embryo summaries without dropping it", () => {
    // Source: Iglewicz & Hoaglin 1993 — modified z-score above 3.5 marks a potential outlier.
    const summaries = Object.fromEntries(group.map((p, i) => [p.embryo, { lambdaUm: i === 7 ? 140 : 80 + ((i * 37) % 11) - 5 }]));
    const r = analysePrecision(group, { ...quick, embryoSummaries: summaries });
    expect(r.outliers.flagged.filter((f) => f.metric === "lambdaUm").map((f) => f.embryo)).toEqual([group[7].embryo]);
    expect(r.nEmbryos).toBe(40);
    expect(r.warnings.map((w) => w.code)).toContain("outliers");
  });

  it("throws a RangeError naming the embryo for malformed profiles and refuses fewer than 3 embryos", () => {
    // common practice, no source.
    const bad = group.map((p, i) => (i === 2 ? { ...p, positionUm: Array.from(p.positionUm).map((v, k) => (k === 5 ? 0 : v)) } : p));
    expect(() => analysePrecision(bad, quick)).toThrow(new RegExp(`embryo "${group[2].embryo}", point 5: positionUm must ascend strictly`));
    expect(() => analysePrecision(group.slice(0, 2), quick)).toThrow(/needs at least 3 embryos, got 2/);
    expect(() => analysePrecision(group.map(({ lengthUm: _, ...p }) => p), { ...quick, coords: "relative" })).toThrow(/relative coordinates need lengthUm/);
  });

  it("states the normalisation and how much across-embryo variance it removed", () => {
    // Source: METHODS.md §4 — per-embryo normalisation removes amplitude variation; report which was used.
    const amplitude = exponentialGroup({ embryos: 40, lambdaUm: 80, cv: 0.2, noise: "amplitude", seed: 73 });
    const r = analysePrecision(amplitude, { ...quick, normalisation: "scale-offset" });
    expect(r.normalisation.method).toBe("scale-offset");
    expect(r.normalisation.converged).toBe(true);
    const step = r.normalisation.varianceSteps.find((s) => s.step === "normalisation")!;
    expect(step.fractionRemoved!).toBeGreaterThan(0.99);
    expect(r.warnings.map((w) => w.code)).toContain("normalisation-may-understate");
  });
});
