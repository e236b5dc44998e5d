/**
 * What each column of an export means, from its header: a role, and the unit
 * written in the header if any ("position [µm]", "x (px)", "x/L", "age_min").
 * Matching is case-insensitive and accepts common variants of each name.
 */
export type ColumnRole =
  | "embryo" | "position" | "intensity" | "genotype" | "channel" | "stage" | "age"
  | "length" | "time" | "dosage" | "session" | "pixel-size" | "other";

export interface ColumnHeader {
  index: number;
  header: string;
  role: ColumnRole;
  /** Unit text found in the header, not yet interpreted (e.g. "px", "min"). */
  unitText: string | null;
}

const NAMES: [ColumnRole, string[]][] = [
  ["embryo", ["embryo", "embryo id", "embryo_id", "embryoid", "embryo label", "sample", "sample id", "specimen", "id", "label", "name", "individual", "animal", "larva", "disc", "tissue", "replicate", "rep"]],
  ["position", ["x", "pos", "position", "distance", "dist", "ap", "ap position", "dv", "dv position", "axis position", "coordinate", "arc length", "relative position", "rel pos", "rel position", "x/l"]],
  ["intensity", ["intensity", "value", "signal", "fluorescence", "fluo", "mean", "mean intensity", "gray value", "grey value", "grayvalue", "greyvalue", "y", "i", "counts", "int", "raw intensity", "concentration"]],
  ["genotype", ["genotype", "line", "strain", "condition", "group", "allele"]],
  ["channel", ["channel", "target", "gene", "marker", "stain", "antibody", "probe", "readout", "reporter"]],
  ["stage", ["stage", "cycle", "developmental stage"]],
  ["age", ["age", "embryo age", "developmental age", "time after fertilization", "time after egg laying"]],
  ["length", ["length", "embryo length", "egg length", "tissue length", "l", "total length", "axis length"]],
  ["time", ["time", "t", "timepoint", "time point"]],
  ["dosage", ["dosage", "dose", "gene dosage", "copies", "copy number", "gene copies"]],
  ["session", ["session", "batch", "imaging session", "experiment", "date"]],
  ["pixel-size", ["pixel size", "pixel_size", "pixelsize", "px size", "scale"]],
];

const LOOKUP = new Map<string, ColumnRole>();
for (const [role, names] of NAMES) for (const n of names) LOOKUP.set(n, role);

const SUFFIX_UNITS = ["um", "µm", "μm", "px", "mm", "nm", "min", "s", "sec", "h", "hr", "hpf", "pct"];

/** Split "position [µm]" into ("position", "µm"); "age_min" into ("age", "min"); "x/L" into ("x", "x/l"). */
export function splitHeaderUnit(header: string): { name: string; unitText: string | null } {
  const h = header.trim();
  const bracket = /^(.*?)\s*[[({]\s*([^\])}]*)\s*[\])}]\s*$/.exec(h);
  if (bracket && bracket[1] !== "") return { name: normaliseName(bracket[1]), unitText: bracket[2].trim() };
  if (/^(x|position|pos)\s*\/\s*l$/i.test(h)) return { name: "x", unitText: "x/l" };
  const pct = /^(.*?)\s*%\s*$/.exec(h);
  if (pct && pct[1] !== "") return { name: normaliseName(pct[1]), unitText: "%" };
  const suffix = /^(.*?)[ _.-]+([a-zµμ%]+)$/i.exec(h);
  if (suffix && SUFFIX_UNITS.includes(suffix[2].toLowerCase())) {
    const name = normaliseName(suffix[1]);
    if (LOOKUP.has(name)) return { name, unitText: suffix[2].toLowerCase() === "pct" ? "%" : suffix[2] };
  }
  return { name: normaliseName(h), unitText: null };
}

function normaliseName(s: string): string {
  return s.trim().toLowerCase().replace(/[_.-]+/g, " ").replace(/\s+/g, " ");
}

export function classifyHeaders(headers: string[]): ColumnHeader[] {
  return headers.map((header, index) => {
    const { name, unitText } = splitHeaderUnit(header);
    const role = LOOKUP.get(name) ?? LOOKUP.get(name.replace(/ /g, "")) ?? "other";
    return { index, header, role, unitText };
  });
}
