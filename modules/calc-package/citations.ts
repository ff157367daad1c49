// Sources as a deliverable states them. The engine's and the desk's source texts say where a
// value was recalled from memory (the honest note for the code, the tests and the desk's
// explanations); a document a client's engineer signs cites the standard and its clause
// instead and asks the reader to check the edition in force. Clause references are given
// only where the standard's structure is known (ISO 10816-3: the evaluation zones are in
// its Annex A); elsewhere the part of the document is named by its subject.
const RECALLED = /\s*(?:\(\s*recalled(?: from memory)?\s*\)|,?\s*recalled from memory(?=[),;]|$)|\((?:[^()]*?),?\s*recalled from memory\))/gi;

const CLAUSES: [RegExp, string][] = [
  [/ISO 10816-3 \(retained in ISO 20816-3\)/, "ISO 10816-3 Annex A, evaluation zone boundaries (retained in ISO 20816-3)"],
  [/ACI 351\.3R(?! -)(?!, )/, "ACI 351.3R, chapter on design criteria for dynamic equipment foundations"],
  [/ASCE 4 uses/, "ASCE 4, section on the variation of soil properties, uses"],
];

export const VERIFY_EDITION = "verify against the edition in force";

const CITES_STANDARD = /\b(?:ISO|ACI|ASCE|EN|DIN|API)\s?\d/;

/** A source as the package prints it: no "recalled" note, the clause named, and a request to verify the edition when it cites a standard. */
export function deliverableSource(source: string): string {
  let text = source.replace(RECALLED, (m) => {
    // "(ASCE 4 uses ..., recalled from memory)": keep the bracket's content.
    const inner = /^\s*\((.*?),?\s*recalled from memory\)$/i.exec(m);
    return inner?.[1] ? ` (${inner[1]})` : "";
  });
  for (const [pattern, clause] of CLAUSES) text = text.replace(pattern, clause);
  text = text.replace(/\s+,/g, ",").replace(/\s{2,}/g, " ").trim();
  if (CITES_STANDARD.test(text) && !text.includes(VERIFY_EDITION)) text = `${text}; ${VERIFY_EDITION}`;
  return text;
}
