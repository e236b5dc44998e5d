import { createWriteStream } from "node:fs";
import { once } from "node:events";
import { createRandom } from "../server/analysis/random/seededRandom.ts";

/** Size of an invented long-format export for the benchmarks. */
export interface LongCsvSpec {
  embryos: number;
  points: number;
  seed: number;
  /** Genotypes given to embryos in turn; wt and tardy by default. */
  genotypes?: string[];
}

/**
 * Write an invented long table (embryo, genotype, position [µm], intensity), one
 * row per point: exponential gradients A·exp(-x/λ) + B with 2% noise, λ between
 * 20 and 80 µm, 0.5 µm pixels. Written in blocks so a 10,000-embryo file needs
 * no more memory than one embryo. Returns the file's size in bytes.
 */
export async function writeLongCsv(path: string, spec: LongCsvSpec): Promise<number> {
  const random = createRandom(spec.seed);
  const out = createWriteStream(path);
  let bytes = 0;
  const write = async (text: string) => {
    bytes += Buffer.byteLength(text);
    if (!out.write(text)) await once(out, "drain");
  };
  await write("embryo,genotype,position [µm],intensity\n");
  for (let e = 0; e < spec.embryos; e++) {
    const label = `e${String(e + 1).padStart(5, "0")}`;
    const genotypes = spec.genotypes ?? ["wt", "tardy"];
    const genotype = genotypes[e % genotypes.length];
    const lambdaUm = 20 + 60 * random.uniform();
    const amplitude = 50 + 150 * random.uniform();
    const background = 5 + 15 * random.uniform();
    let block = "";
    for (let i = 0; i < spec.points; i++) {
      const x = 0.5 * i;
      const y = amplitude * Math.exp(-x / lambdaUm) + background + 0.02 * amplitude * random.normal();
      block += `${label},${genotype},${x.toFixed(1)},${y.toFixed(3)}\n`;
    }
    await write(block);
  }
  out.end();
  await once(out, "finish");
  return bytes;
}
