/**
 * Query parameters for a metadata filter typed as "KEY=VALUE, KEY=VALUE":
 * each pair becomes `meta.KEY=VALUE`. Pairs without "=" or without a key are
 * returned as problems rather than silently dropped.
 */
export function metadataFilter(text: string): { query: Record<string, string>; problems: string[] } {
  const query: Record<string, string> = {};
  const problems: string[] = [];
  for (const part of text.split(",")) {
    const pair = part.trim();
    if (!pair) continue;
    const eq = pair.indexOf("=");
    const key = eq > 0 ? pair.slice(0, eq).trim() : "";
    if (!key) {
      problems.push(`"${pair}" is not KEY=VALUE`);
      continue;
    }
    query[`meta.${key}`] = pair.slice(eq + 1).trim();
  }
  return { query, problems };
}
