// Formulas that reach outside the workbook: a DDE link starts a program on the reader's
// machine (=cmd|' /C calc'!A0), web-service and import functions fetch or send data, a
// hyperlink opens a site, RTD/CALL/REGISTER.ID load code, and a reference into another
// workbook reads a file the desk has never seen. A machine data sheet needs none of them,
// and a saved value does not make them safe (Excel recomputes when the file is opened),
// so a workbook holding any of them is refused, cell by cell (OWASP, "CSV Injection";
// Microsoft, "Dynamic Data Exchange" security advisory ADV170021).

/** Functions that fetch, send, open or run something outside the file. */
const outsideFunctions = [
  "WEBSERVICE",
  "FILTERXML",
  "HYPERLINK",
  "RTD",
  "CALL",
  "REGISTER",
  "REGISTER.ID",
  "EXEC",
  "DDE",
  "DDEAUTO",
  "IMPORTDATA",
  "IMPORTXML",
  "IMPORTHTML",
  "IMPORTFEED",
  "IMPORTRANGE",
  "IMAGE",
  "SQL.REQUEST",
  "STOCKHISTORY",
];

// Newer functions are stored with a prefix in the file (_xlfn.WEBSERVICE); a name is a
// function when an opening parenthesis follows it.
const functionPattern = new RegExp(`(?:^|[^A-Za-z0-9_.])(?:_xlfn\\.|_xlws\\.|_xll\\.)?(${outsideFunctions.map((f) => f.replace(".", "\\.")).join("|")})\\s*\\(`, "i");

/** The formula with every string literal emptied (its text cannot call anything). */
function withoutStrings(formula: string): string {
  return formula.replace(/"(?:[^"]|"")*"/g, '""');
}

/** Sheet prefixes of references: 'quoted name'! or bare-name! (bare names may carry [n]). */
const sheetPrefixPattern = /'((?:[^']|'')*)'!|([A-Za-z0-9_.[\]]+)!/g;

/**
 * Why a formula reaches outside the workbook, or null when it stays inside it.
 * `formula` is the text as stored (without the leading =).
 */
export function outsideReachOfFormula(formula: string): string | null {
  const f = withoutStrings(formula.replace(/^=/, ""));
  // DDE: application|topic!item; a pipe has no other meaning in a formula outside strings.
  if (f.includes("|")) return "a DDE link (it would start a program on the reader's computer)";
  const fn = functionPattern.exec(f);
  if (fn) return `the function ${fn[1]!.toUpperCase()} (it fetches, opens or runs something outside the file)`;
  // INDIRECT builds a reference from text; only a literal naming a cell of this workbook can be checked.
  const indirect = /(?:^|[^A-Za-z0-9_.])(?:_xlfn\.)?INDIRECT\s*\(/i.exec(f);
  if (indirect) {
    const literals = [...formula.matchAll(/INDIRECT\s*\(\s*"((?:[^"]|"")*)"\s*[,)]/gi)].map((m) => m[1] ?? "");
    const calls = f.match(/INDIRECT\s*\(/gi)?.length ?? 0;
    if (literals.length < calls || literals.some((t) => /[[\]\\/|]|:\\|https?:/i.test(t))) {
      return "INDIRECT with a reference that is built or points outside the file";
    }
  }
  // Sheet names cannot hold [ ] \ / (Excel's rule), so a prefix holding one names another
  // file ('C:\dir\[book.xlsx]Sheet'!A1, [1]Sheet!A1); a colon alone is a 3-D range of sheets.
  for (const m of f.matchAll(sheetPrefixPattern)) {
    const name = m[1] ?? m[2] ?? "";
    if (/[[\]\\/]/.test(name)) return "a reference to another workbook or file";
  }
  // A defined name of another workbook: [1]!Name or [book.xlsx]!Name.
  if (/\[[^\]]*\]\s*!/.test(f)) return "a reference to another workbook or file";
  return null;
}
