import { UserError } from "../userError.ts";
import { numberOption } from "./cliNumbers.ts";

/** A fit window as the fit options take it: each end in µm or as a fraction of the embryo length. */
export interface WindowOptionValue {
  xMinUm?: number;
  xMaxUm?: number;
  xMinFractionOfLength?: number;
  xMaxFractionOfLength?: number;
}

/**
 * "A:B" with each end in µm ("30") or as a fraction of the embryo's length
 * ("0.1L"), either end open: "30:", ":0.8L", "0.1L:0.8L".
 */
export function windowOption(name: string, value: string | undefined): WindowOptionValue | undefined {
  if (value === undefined) return undefined;
  const m = /^\s*([^:]*):([^:]*)\s*$/.exec(value);
  if (!m) throw new UserError("bad-option", `--${name}: "${value}" is not a window; write FROM:TO, FROM: or :TO, each end in µm (30) or as a fraction of the embryo length (0.1L)`);
  const out: WindowOptionValue = {};
  const end = (text: string, which: "Min" | "Max") => {
    const t = text.trim();
    if (t === "") return;
    if (/[lL]$/.test(t)) {
      const f = numberOption(name, t.slice(0, -1));
      if (f === undefined || f < 0 || f > 1) throw new UserError("bad-option", `--${name}: "${t}" must be a fraction of the length between 0L and 1L`);
      out[`x${which}FractionOfLength`] = f;
    } else out[`x${which}Um`] = numberOption(name, t);
  };
  end(m[1], "Min");
  end(m[2], "Max");
  const sameUnit = (a?: number, b?: number) => a === undefined || b === undefined || b > a;
  if (!sameUnit(out.xMinUm, out.xMaxUm) || !sameUnit(out.xMinFractionOfLength, out.xMaxFractionOfLength))
    throw new UserError("bad-option", `--${name}: the end of "${value}" must be greater than its start`);
  return out;
}
