import { el } from "../../components/el.ts";
import { field, numberInput, numberValue, select, textInput } from "../../components/formFields.ts";

/** The import settings as the upload form fields the API reads. */
export type ImportFields = Record<string, string>;

/**
 * The import settings: the everyday ones in view, the ones auto-detection
 * usually gets right behind "More options". Calls `onChange` when any changes.
 */
export function importOptionsForm(onChange: () => void): { element: HTMLElement; fields(): ImportFields } {
  const genotype = textInput("genotype", "", "from the file or side file");
  const channel = textInput("channel", "", "signal");
  const pixelSize = numberInput("pixelSizeUm", "", { min: 0, placeholder: "positions in px only" });
  const length = numberInput("lengthUm", "", { min: 0, placeholder: "positions as x/L only" });
  const labelPrefix = textInput("labelPrefix", "", "e.g. run2-");
  const flip = select("flip", [
    ["none", "none: keep as written, warn"],
    ["auto", "auto: reverse profiles rising away from the source"],
  ]);
  const format = select("format", [
    ["auto", "detect"],
    ["long", "long (one row per point)"],
    ["wide", "wide (one column per embryo)"],
  ]);
  const delimiter = select("delimiter", [
    ["auto", "detect"],
    [",", "comma"],
    [";", "semicolon"],
    ["\t", "tab"],
  ]);
  const decimalMark = select("decimalMark", [
    ["auto", "detect"],
    [".", "point (1.5)"],
    [",", "comma (1,5)"],
  ]);
  const positionUnit = select("positionUnit", [
    ["auto", "from the header (µm if none)"],
    ["um", "µm"],
    ["px", "pixels (needs pixel size)"],
    ["fraction", "fraction of length x/L (needs length)"],
  ]);

  const element = el(
    "fieldset",
    { class: "import-options" },
    el("legend", {}, "Import options"),
    el(
      "div",
      { class: "field-row" },
      field("Genotype", genotype, "for embryos without one"),
      field("Channel", channel, "for files without a channel column"),
      field("Pixel size (µm)", pixelSize),
      field("Embryo length (µm)", length),
      field("Label prefix", labelPrefix, "keeps two files' 1, 2, 3… apart"),
      field("Flip", flip),
    ),
    el(
      "details",
      {},
      el("summary", {}, "More options"),
      el("div", { class: "field-row" }, field("Table shape", format), field("Separator", delimiter), field("Decimal mark", decimalMark), field("Position unit", positionUnit, "when the header names none")),
    ),
  );
  element.addEventListener("change", onChange);

  return {
    element,
    fields() {
      const out: ImportFields = {};
      const put = (k: string, v: string | number | undefined) => {
        if (v !== undefined && String(v).trim() !== "") out[k] = String(v).trim();
      };
      put("genotype", genotype.value);
      put("channel", channel.value);
      put("pixelSizeUm", numberValue(pixelSize));
      put("lengthUm", numberValue(length));
      put("labelPrefix", labelPrefix.value);
      put("flip", flip.value);
      put("format", format.value);
      out.delimiter = delimiter.value;
      put("decimalMark", decimalMark.value);
      put("positionUnit", positionUnit.value);
      return out;
    },
  };
}
