// For CSV output only. In an .xlsx file every string is a string cell, which a spreadsheet
// never evaluates, so the package writes text exactly as typed. A CSV file has no cell
// types: a spreadsheet opening it takes a leading =, +, - or @ (and tab or carriage
// return) as the start of a formula. There a leading apostrophe is the usual guard
// (OWASP, "CSV Injection"), so every string a person typed passes through safeText before
// it is written to a CSV field.
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
