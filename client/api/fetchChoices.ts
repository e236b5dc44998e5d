import { apiGet } from "./http.ts";

/** The genotypes and channels stored, for the pickers of every view. */
export interface Choices {
  genotypes: string[];
  channels: string[];
}

export async function fetchChoices(): Promise<Choices> {
  const [g, c] = await Promise.all([apiGet<{ values: string[] }>("api/groups", { by: "genotype" }), apiGet<{ values: string[] }>("api/groups", { by: "channel" })]);
  return { genotypes: g.values, channels: c.values };
}
