// Figures of site measurements (commissioning) as the desk and the package show them: every
// number through the one formatter (format-number.ts) in the project's units, the unit symbol
// as defined (never case-changed).
import { formatSignificant, toDisplay, unitSymbol, type QuantityKindKey, type UnitSystemKey } from "@/modules/units";
import type { FoundationSoilFlag } from "./measurement-flag";

/** A stored SI value in the display unit of its kind, with 3 significant figures and its symbol. */
export function formatMeasured(kind: QuantityKindKey, storedValue: number | null | undefined, system: UnitSystemKey): string {
  if (storedValue === null || storedValue === undefined || !Number.isFinite(storedValue)) return "—";
  const symbol = unitSymbol(kind, system);
  const text = formatSignificant(toDisplay(kind, storedValue, system));
  return symbol ? `${text} ${symbol}` : text;
}

/** A dimensionless ratio (measured / predicted), 3 significant figures. */
export function formatRatio(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  return formatSignificant(value);
}

/** The project table's words for a foundation's soil flag. */
export function soilFlagText(flag: FoundationSoilFlag, system: UnitSystemKey): string {
  const g = formatMeasured("modulus", flag.fittedShearModulus, system);
  const band = `${formatMeasured("modulus", flag.bandLower, system)} to ${formatMeasured("modulus", flag.bandUpper, system)}`;
  return `site-measured soil G ${g} ${flag.side} the design band (${band})`;
}
