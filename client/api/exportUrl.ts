/** Link to a server CSV export of a results table (fits, precision, comparison, tracking, plan, an analysis's inputs). */
export function csvExportUrl(table: "fits" | "precision" | "comparison" | "tracking" | "plan" | "inputs", query: Record<string, string | number | undefined>): string {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(query)) if (v !== undefined && v !== "") params.set(k, String(v));
  const q = params.toString();
  return `api/exports/${table}.csv${q ? `?${q}` : ""}`;
}
