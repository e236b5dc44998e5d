/** A label made safe for a file name: letters, digits, dot, dash and underscore only. */
export function fileNamePart(label: string): string {
  return label.normalize("NFKD").replace(/[^A-Za-z0-9._-]+/g, "-").replace(/^-+|-+$/g, "") || "x";
}
