/** What an uploaded file is: profile data, or the side file of per-embryo metadata. */
export type FileRole = "profiles" | "meta";

/** A first guess from the file name, which the user can change: side files are usually named "…meta…". */
export function guessFileRole(fileName: string): FileRole {
  return /meta/i.test(fileName) ? "meta" : "profiles";
}
