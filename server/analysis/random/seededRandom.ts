/**
 * A small, fast, seedable pseudo-random generator so that every simulation,
 * bootstrap and permutation in morphogauge is reproducible from its seed.
 *
 * Core: xoshiro128** (Blackman & Vigna 2018, "Scrambled linear pseudorandom
 * number generators"), state seeded by splitmix32 so that nearby seeds give
 * unrelated streams.
 */
export interface Random {
  /** Uniform on [0, 1). */
  uniform(): number;
  /** Standard normal N(0, 1) (Marsaglia polar method). */
  normal(): number;
  /** Uniform integer in [0, n). */
  int(n: number): number;
  /** The seed this stream started from. */
  readonly seed: number;
}

function splitmix32(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x9e3779b9) >>> 0;
    let z = s;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
    return (z ^ (z >>> 16)) >>> 0;
  };
}

export function createRandom(seed: number): Random {
  if (!Number.isFinite(seed)) throw new RangeError(`createRandom: seed must be a finite number, got ${seed}`);
  const init = splitmix32(Math.floor(seed));
  let a = init(), b = init(), c = init(), d = init();
  if ((a | b | c | d) === 0) a = 1;
  let spare: number | null = null;

  const next = (): number => {
    const result = Math.imul(rotl(Math.imul(b, 5), 7), 9) >>> 0;
    const t = b << 9;
    c ^= a; d ^= b; b ^= c; a ^= d;
    c ^= t;
    d = rotl(d, 11);
    return result;
  };

  const uniform = (): number => {
    // 53 random bits from two 32-bit draws.
    const hi = next() >>> 5;
    const lo = next() >>> 6;
    return (hi * 67108864 + lo) / 9007199254740992;
  };

  return {
    seed,
    uniform,
    normal() {
      if (spare !== null) {
        const s = spare;
        spare = null;
        return s;
      }
      let u: number, v: number, r: number;
      do {
        u = 2 * uniform() - 1;
        v = 2 * uniform() - 1;
        r = u * u + v * v;
      } while (r >= 1 || r === 0);
      const f = Math.sqrt((-2 * Math.log(r)) / r);
      spare = v * f;
      return u * f;
    },
    int(n: number) {
      if (!Number.isInteger(n) || n <= 0) throw new RangeError(`Random.int: n must be a positive integer, got ${n}`);
      return Math.floor(uniform() * n);
    },
  };
}

function rotl(x: number, k: number): number {
  return ((x << k) | (x >>> (32 - k))) >>> 0;
}
