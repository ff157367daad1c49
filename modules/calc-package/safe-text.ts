// Every string a person typed (names of boxes, machines, rotors, points, people, notes)
// passes through safeText before it reaches a cell. exceljs writes strings as string
// cells, so Excel never evaluates them as written; but a cell that is copied, re-typed
// or saved as CSV is read again by a spreadsheet, which takes a leading =, +, - or @
// (and tab or carriage return) as the start of a formula. A leading apostrophe is the
// usual guard (OWASP, "CSV Injection"): the text then stays text everywhere.
const formulaLead = /^[=+\-@\t\r]/;

/** The text as it must be written to a cell: unchanged, or with a leading apostrophe when a spreadsheet would read it as a formula. */
export function safeText(value: string | null | undefined): string {
  const text = value ?? "";
  return formulaLead.test(text) ? `'${text}` : text;
}

/** True when safeText would change the text (for tests and notes). */
export function looksLikeFormula(value: string): boolean {
  return formulaLead.test(value);
}
