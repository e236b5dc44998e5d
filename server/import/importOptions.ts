import { z } from "zod";

/** Every import setting and its default, in one place. */
export const ImportOptions = z.object({
  /** Table shape; 'auto' tells long from wide by the header. */
  format: z.enum(["auto", "long", "wide"]).default("auto"),
  /** Field separator; 'auto' picks tab, semicolon or comma from the header line. */
  delimiter: z.enum(["auto", ",", ";", "\t"]).default("auto"),
  /** Decimal mark; 'auto' accepts decimal commas when the separator is not a comma. */
  decimalMark: z.enum(["auto", ".", ","]).default("auto"),
  /** Unit of the position column when its header names none. */
  positionUnit: z.enum(["auto", "um", "px", "fraction"]).default("auto"),
  /** Pixel size in µm, required when positions are in pixels. */
  pixelSizeUm: z.number().positive().optional(),
  /** Embryo (or tissue) length in µm for every embryo that has none in the file or side file. */
  lengthUm: z.number().positive().optional(),
  /** Genotype for every embryo that has none in the file or side file. */
  genotype: z.string().trim().min(1).max(200).optional(),
  /** Channel (target) name for profiles whose file has no channel column. */
  channel: z.string().trim().min(1).max(200).default("signal"),
  /** Prepended to every embryo label, to keep two files' "1, 2, 3…" apart. */
  labelPrefix: z.string().max(100).default(""),
  /** 'auto' reverses profiles that rise away from the source end; 'none' only warns. */
  flip: z.enum(["none", "auto"]).default("none"),
  /** Largest accepted file, in bytes (50 MB by default). */
  maxBytes: z.number().int().positive().default(50 * 1024 * 1024),
  /** Most embryos accepted from one file. */
  maxEmbryos: z.number().int().positive().default(5000),
});

export type ImportOptionsInput = z.input<typeof ImportOptions>;
export type ResolvedImportOptions = z.output<typeof ImportOptions>;
