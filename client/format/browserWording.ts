/**
 * The server's messages name command-line options ("give --pixel-size in µm");
 * on the page the same setting is a labelled field. Each entry maps an option
 * to the words the page uses for it; longer patterns come first.
 */
const OPTION_WORDS: [RegExp, string][] = [
  [/--on-conflict keep/g, "\u201cKeep the stored values\u201d"],
  [/--on-conflict replace/g, "\u201cTake the file's values\u201d"],
  [/--on-conflict refuse/g, "\u201cImport nothing while values differ\u201d"],
  [/--flip auto/g, "Flip \u201cauto\u201d"],
  [/--flip none/g, "Flip \u201cnone\u201d"],
  [/--pixel-size( in \u00b5m)?/g, "the \u201cPixel size (\u00b5m)\u201d field"],
  [/--length( in \u00b5m)?/g, "the \u201cEmbryo length (\u00b5m)\u201d field"],
  [/--position-unit [a-z|]+/g, "the \u201cPosition unit\u201d field"],
  [/--genotype/g, "the \u201cGenotype\u201d field"],
  [/--channel/g, "the \u201cChannel\u201d field"],
  [/--label-prefix/g, "the \u201cLabel prefix\u201d field"],
  [/--format/g, "the \u201cTable shape\u201d field"],
  [/\(raise it with --max-embryos\)/g, "(split the file into smaller ones)"],
  [/--window (\d+(?:\.\d+)?):/g, "\u201cWindow from (\u00b5m)\u201d = $1 in the Fits view"],
  [/--meta\b/g, "a metadata side file"],
];

/** A server message reworded for the page: command-line options become the fields that set them. */
export function browserWording(message: string): string {
  let text = message;
  for (const [pattern, words] of OPTION_WORDS) text = text.replace(pattern, words);
  return text;
}
