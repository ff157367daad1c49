// SI <-> US customary conversion for display and entry. The contract and the database stay
// SI; only what a person reads and types changes with the unit system.
export { quantityKinds, quantityKindKeys, displayUnit, defineQuantityKind, type QuantityKind, type QuantityKindKey, type UnitInfo, type UnitSystemKey } from "./quantity-kinds";
export { convertValue, fromDisplay, toDisplay, unitSymbol } from "./convert";
export { formatDefault, formatFeetInches, formatNumber, formatQuantity, parseFeetInches, parseQuantity, type FormatOptions, type ParseQuantityResult } from "./format";
export * as units from "./unit-definitions";
export { formatSignificant, significantDecimals, significantExcelFormat, SCI_LARGE, SCI_SMALL, type SignificantOptions } from "./format-number";
