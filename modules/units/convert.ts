// Conversion between the stored SI value of a quantity and what a unit system shows.
import { quantityKinds, type QuantityKindKey, type UnitInfo, type UnitSystemKey } from "./quantity-kinds";

/** A value in unit `from` expressed in unit `to` (both of one dimension). */
export function convertValue(value: number, from: UnitInfo, to: UnitInfo): number {
  // Same size: return the value itself, so SI-to-SI display never picks up rounding.
  if (from.siValue === to.siValue) return value;
  return (value * from.siValue) / to.siValue;
}

/** The stored (contract) value of a kind, in the unit the system shows. */
export function toDisplay(kind: QuantityKindKey, storedValue: number, system: UnitSystemKey): number {
  const k = quantityKinds[kind];
  return convertValue(storedValue, k.base, k[system]);
}

/** A value typed in the system's unit, back to the stored (contract) unit. */
export function fromDisplay(kind: QuantityKindKey, displayValue: number, system: UnitSystemKey): number {
  const k = quantityKinds[kind];
  return convertValue(displayValue, k[system], k.base);
}

/** The symbol the system shows for a kind ("ft", "kPa", "" for a ratio). */
export function unitSymbol(kind: QuantityKindKey, system: UnitSystemKey): string {
  return quantityKinds[kind][system].symbol;
}
