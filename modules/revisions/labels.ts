// Revision labels. A project uses letters (A, B, C … while in check) or numbers
// (0, 1, 2 … for issue for construction); it may switch from one to the other,
// so each scheme counts only the labels already issued in that scheme.
export type RevisionScheme = "letters" | "numbers";

/** 0 -> A, 25 -> Z, 26 -> AA, 27 -> AB … (spreadsheet-style, no gaps). */
export function letterLabel(index: number): string {
  if (!Number.isInteger(index) || index < 0) throw new RangeError(`revision index must be a non-negative integer, got ${index}`);
  let n = index;
  let out = "";
  do {
    out = String.fromCharCode(65 + (n % 26)) + out;
    n = Math.floor(n / 26) - 1;
  } while (n >= 0);
  return out;
}

export function isLetterLabel(label: string): boolean {
  return /^[A-Z]+$/.test(label);
}

export function isNumberLabel(label: string): boolean {
  return /^(0|[1-9][0-9]*)$/.test(label);
}

/** The label the next revision of a foundation gets, given the labels it already has. */
export function nextRevisionLabel(scheme: RevisionScheme, existingLabels: readonly string[]): string {
  if (scheme === "letters") return letterLabel(existingLabels.filter(isLetterLabel).length);
  return String(existingLabels.filter(isNumberLabel).length);
}
