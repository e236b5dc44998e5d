import { describe, expect, it } from "vitest";
import { analysePrecision } from "../../../server/analysis/precision/analysePrecision.ts";
import { decodingMap } from "../../../server/analysis/precision/decodingMap.ts";
import { createRandom } from "../../../server/analysis/random/seededRandom.ts";
import { runPython } from "../../helpers/python.ts";
import { exponentialGroup } from "./simulateGradients.ts";

describe("maximum-likelihood decoding map", () => {
  it("decoded positions scatter by σ_x = λ·CV around the true position (200 embryos), and each row is a distribution", () => {
    // Source: Tkačik et al. 2015, Genetics — in the small-noise limit the maximum-likelihood decoder's error
    // is σ_x (Cramér–Rao bound attained); METHODS.md §4 for σ_x = λ·CV.
    const group = exponentialGroup({ embryos: 200, lambdaUm: 80, cv: 0.1, noise: "pointwise", seed: 51 });
    const r = analysePrecision(group, { bootstrap: { resamples: 0 }, information: { extrapolate: false } });
    const map = r.decoding!;
    expect(map.leaveOneOut).toBe(true);
    expect(map.positions).toEqual(r.gridX.slice(r.positionalInformation.region!.startIndex, r.positionalInformation.region!.endIndex + 1));
    map.probability.forEach((row) => expect(row.reduce((s, v) => s + v, 0)).toBeCloseTo(1, 12));
    const middle = map.positions.map((x, t) => [x, t] as const).filter(([x]) => x >= 100 && x <= 300);
    const meanSd = middle.reduce((s, [, t]) => s + (map.decodedSd[t] as number), 0) / middle.length;
    expect(Math.abs(meanSd / 8 - 1)).toBeLessThan(0.1);
    middle.forEach(([x, t]) => expect(Math.abs((map.decodedMean[t] as number) - x)).toBeLessThan(3));
  });

  it("leave-one-out decoding with one channel matches a brute-force numpy recomputation", async () => {
    const random = createRandom(52);
    const x = Array.from({ length: 15 }, (_, k) => k);
    const values = Array.from({ length: 9 }, () => x.map((v) => 10 * Math.exp(-v / 5) * (1 + 0.2 * random.normal())));
    const map = decodingMap(x, [values], 0, 14, true);
    // Source: numpy as reference — mean and variance (ddof=1) of the other embryos at each candidate, Gaussian
    // log-likelihood, argmax.
    const ref = await runPython<number[][]>(
      `
c = np.array(data)
n, g = c.shape
counts = np.zeros((g, g))
for i in range(n):
    others = np.delete(c, i, axis=0)
    mu = others.mean(axis=0); var = others.var(axis=0, ddof=1)
    for t in range(g):
        ll = -0.5 * np.log(var) - (c[i, t] - mu) ** 2 / (2 * var)
        counts[t, np.argmax(ll)] += 1
result = (counts / n).tolist()
`,
      values,
    );
    map.probability.forEach((row, t) => row.forEach((p, d) => expect(p).toBeCloseTo(ref[t][d], 12)));
  });

  it("leave-one-out decoding with two correlated channels matches a brute-force numpy recomputation", async () => {
    const random = createRandom(53);
    const x = Array.from({ length: 12 }, (_, k) => k);
    const n = 10;
    const a: number[][] = [];
    const b: number[][] = [];
    for (let i = 0; i < n; i++) {
      const shared = x.map(() => random.normal());
      a.push(x.map((v, k) => 8 - 0.6 * v + 0.5 * shared[k]));
      b.push(x.map((v, k) => 1 + 0.4 * v + 0.3 * shared[k] + 0.3 * random.normal()));
    }
    const map = decodingMap(x, [a, b], 0, 11, true);
    // Source: numpy.linalg.slogdet and numpy.linalg.solve as reference for the bivariate Gaussian likelihood.
    const ref = await runPython<number[][]>(
      `
A = np.array(data["a"]); B = np.array(data["b"])
n, g = A.shape
counts = np.zeros((g, g))
for i in range(n):
    keep = [j for j in range(n) if j != i]
    for t in range(g):
        c = np.array([A[i, t], B[i, t]])
        ll = []
        for k in range(g):
            s = np.stack([A[keep, k], B[keep, k]])
            mu = s.mean(axis=1); C = np.cov(s, ddof=1)
            r = c - mu
            ll.append(-0.5 * np.linalg.slogdet(C)[1] - 0.5 * r @ np.linalg.solve(C, r))
        counts[t, int(np.argmax(ll))] += 1
result = (counts / n).tolist()
`,
      { a, b },
    );
    map.probability.forEach((row, t) => row.forEach((p, d) => expect(p).toBeCloseTo(ref[t][d], 12)));
  });

  it("decodingMap refuses fewer embryos than a leave-one-out covariance needs", () => {
    // common practice, no source: n − 1 embryos must give a non-singular K×K covariance.
    expect(() => decodingMap([0, 1, 2], [[[1, 2, 3], [2, 3, 4], [3, 4, 6]]], 0, 2, true)).toThrow(/too few/);
  });
});

describe("decodingMap with a pooled covariance", () => {
  it("pooling the variance over neighbouring positions matches a brute-force numpy recomputation", async () => {
    const random = createRandom(54);
    const x = Array.from({ length: 21 }, (_, k) => k);
    const values = Array.from({ length: 12 }, () => x.map((v) => 10 * Math.exp(-v / 6) * (1 + 0.15 * random.normal())));
    const map = decodingMap(x, [values], 2, 18, true, 5);
    // Source: numpy as reference — leave-one-out mean at the candidate, variance pooled over the
    // candidate's ±2 neighbours (each about its own mean, ddof = 1 per position), Gaussian argmax.
    const ref = await runPython<number[][]>(
      `
c = np.array(data["v"]); lo, hi, h = data["lo"], data["hi"], data["h"]
n, g = c.shape
cand = list(range(lo, hi + 1))
counts = np.zeros((len(cand), len(cand)))
for i in range(n):
    o = np.delete(c, i, axis=0)
    mu = o.mean(axis=0)
    ss = ((o - mu) ** 2).sum(axis=0)
    var = np.array([ss[max(0, k - h):min(g, k + h + 1)].sum() / (len(range(max(0, k - h), min(g, k + h + 1))) * (n - 2)) for k in cand])
    for ti, t in enumerate(cand):
        ll = -0.5 * np.log(var) - (c[i, t] - mu[cand]) ** 2 / (2 * var)
        counts[ti, np.argmax(ll)] += 1
result = (counts / n).tolist()
`,
      { v: values, lo: 2, hi: 18, h: 2 },
    );
    map.probability.forEach((row, t) => row.forEach((p, d) => expect(p).toBeCloseTo(ref[t][d], 12)));
    expect(map.poolPoints).toBe(5);
  });

  it("pooling removes attractor positions: decodings spread over more distinct positions without widening", () => {
    // Gregor et al. 2007, Cell: for an exponential mean with constant CV the decoder's error is σ_x = λ·CV everywhere;
    // sample noise in the per-position variance makes a few positions collect many decodings.
    const random = createRandom(55);
    const x = Array.from({ length: 120 }, (_, k) => k);
    const values = Array.from({ length: 30 }, () => {
      const a = Math.exp(0.1 * random.normal());
      return x.map((v) => a * 100 * Math.exp(-v / 40) * (1 + 0.03 * random.normal()));
    });
    const heaviestColumn = (m: ReturnType<typeof decodingMap>) => Math.max(...m.positions.map((_, d) => m.probability.reduce((s, row) => s + row[d], 0)));
    const raw = decodingMap(x, [values], 10, 100, true, 1);
    const pooled = decodingMap(x, [values], 10, 100, true, 9);
    expect(heaviestColumn(pooled)).toBeLessThan(heaviestColumn(raw));
    const rms = (m: ReturnType<typeof decodingMap>) => m.rmsError as number;
    expect(rms(pooled)).toBeLessThan(rms(raw) * 1.1);
  });
});
