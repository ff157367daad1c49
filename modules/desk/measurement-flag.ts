// The soil flag a commissioning record raises on its foundation: the fitted shear modulus
// (Pa) outside the design's soil band. Kept here (pure) so the schema, the page and the mail agree.
export interface FoundationSoilFlag {
  recordId: string;
  revisionId: string;
  revisionLabel: string;
  fittedShearModulus: number;
  bandLower: number;
  bandUpper: number;
  side: "below" | "above";
  raisedAt: string;
}

/** Where a fitted G sits against the band: null inside it (bounds included). */
export function sideOfBand(g: number, lower: number, upper: number): "below" | "above" | null {
  if (g < lower) return "below";
  if (g > upper) return "above";
  return null;
}
