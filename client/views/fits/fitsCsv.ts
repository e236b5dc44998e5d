import { csvExportUrl } from "../../api/exportUrl.ts";
import { fitsState } from "./fitsState.ts";

/** The fit table's CSV from the server, with the same genotype and channel filters as the table. */
export function fitsCsv(): { href: string } {
  return { href: csvExportUrl("fits", { genotype: fitsState.genotype, channel: fitsState.channel }) };
}
