// Text for display and entry: fixed decimals per kind, and parsing of what a person types
// (a number, optionally followed by any unit the kind accepts, or feet and inches).
import { convertValue, fromDisplay, toDisplay } from "./convert";
import { quantityKinds, type QuantityKindKey, type UnitSystemKey } from "./quantity-kinds";
import { fixedFormatter } from "./format-number";
import { foot, inch } from "./unit-definitions";

export interface FormatOptions {
  /** Decimals to show; the kind's own for the system when absent. */
  decimals?: number;
  /** Append the unit symbol (default true). */
  withUnit?: boolean;
  /** Group thousands with commas (default true; entry fields turn it off). */
  grouping?: boolean;
}

/** A number with fixed decimals; a non-zero value that would show as 0 keeps 3 significant digits instead. */
export function formatNumber(value: number, decimals: number, grouping = true): string {
  if (!Number.isFinite(value)) return "—";
  const tiny = Math.abs(value) > 0 && Math.abs(value) < 0.5 * 10 ** -decimals;
  const rounded = tiny ? Number(value.toPrecision(3)) : value;
  const digits = tiny ? Math.max(decimals, 3 - 1 - Math.floor(Math.log10(Math.abs(value)))) : decimals;
  // "en-US" pins the decimal point, so what is shown can be typed back in.
  const text = fixedFormatter(digits, grouping).format(rounded);
  return text === "-0" || /^-0\.0*$/.test(text) ? text.slice(1) : text;
}

/** A stored value shown in the system's unit, e.g. "1,250 psf" or "0.305 m". */
export function formatQuantity(kind: QuantityKindKey, storedValue: number, system: UnitSystemKey, options: FormatOptions = {}): string {
  const k = quantityKinds[kind];
  const text = formatNumber(toDisplay(kind, storedValue, system), options.decimals ?? k.decimals[system], options.grouping ?? true);
  const symbol = k[system].symbol;
  return options.withUnit === false || !symbol || text === "—" ? text : `${text} ${symbol}`;
}

/**
 * A default value for a hint under a field, in the field's display unit with up to 3
 * significant figures and no padding zeros: 31.1e-6 m -> "31.1 µm", 1.98e-3 m/s -> "1.98 mm/s",
 * a ratio 3 -> "3".
 */
export function formatDefault(kind: QuantityKindKey, storedValue: number, system: UnitSystemKey): string {
  if (!Number.isFinite(storedValue)) return "—";
  const shown = Number(toDisplay(kind, storedValue, system).toPrecision(3));
  const text = shown.toLocaleString("en-US", { maximumFractionDigits: 12, useGrouping: true });
  const symbol = quantityKinds[kind][system].symbol;
  return symbol ? `${text} ${symbol}` : text;
}

/** A length in feet and inches, e.g. `-5' 6.25"`, for US drawings and tables. */
export function formatFeetInches(metres: number, inchDecimals = 2): string {
  if (!Number.isFinite(metres)) return "—";
  const sign = metres < 0 ? "-" : "";
  const totalInches = Number((Math.abs(metres) / inch.value).toFixed(inchDecimals));
  let feet = Math.floor(totalInches / 12);
  let inches = Number((totalInches - feet * 12).toFixed(inchDecimals));
  if (inches >= 12) {
    feet += 1;
    inches -= 12;
  }
  const shown = inches.toFixed(inchDecimals).replace(/\.?0+$/, "");
  return `${totalInches === 0 ? "" : sign}${feet}' ${shown}"`;
}

export type ParseQuantityResult = { ok: true; value: number } | { ok: false; message: string };

const numberPattern = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:e[+-]?\d+)?/i;
const groupedPattern = /^[+-]?\d{1,3}(?:,\d{3})+(?:\.\d*)?/;

/** Unit text as people type it: "kg/m3", "kip*ft/rad", "um" match "kg/m³", "kip·ft/rad", "µm". */
function normaliseSymbol(s: string): string {
  return s
    .trim()
    .toLowerCase()
    .replace(/[·*⋅\s]/g, "")
    .replace(/³/g, "3")
    .replace(/²/g, "2")
    .replace(/[µμ]/g, "u")
    .replace(/\^/g, "");
}

const feetInchesPattern = /^([+-])?\s*(?:(\d+(?:\.\d*)?)\s*(?:'|ft|feet|foot))?\s*(?:(\d+(?:\.\d*)?)\s*(?:"|in|inch|inches))?$/i;

/** `5' 6"`, `5 ft 6 in`, `-2'`, `7.5"` to metres; null when the text is not feet and inches. */
export function parseFeetInches(text: string): number | null {
  const m = feetInchesPattern.exec(text.trim());
  if (!m || (m[2] === undefined && m[3] === undefined)) return null;
  const sign = m[1] === "-" ? -1 : 1;
  const metres = Number(m[2] ?? 0) * foot.value + Number(m[3] ?? 0) * inch.value;
  return sign * metres;
}

/**
 * What a person typed into a field of this kind, to the stored (contract) value. A bare
 * number is in the system's unit; a number followed by any unit the kind accepts is taken
 * in that unit; lengths also take feet and inches.
 */
export function parseQuantity(kind: QuantityKindKey, text: string, system: UnitSystemKey): ParseQuantityResult {
  const trimmed = text.trim();
  if (!trimmed) return { ok: false, message: "Enter a number" };
  // Feet and inches together, or marked with ' and "; a plain "12 ft" takes the unit path below.
  const feetAndInches = /['"]/.test(trimmed) || /(ft|feet|foot)\s*[\d.]+\s*(in|inch|inches)$/i.test(trimmed);
  if ((kind === "length" || kind === "displacement") && feetAndInches) {
    const metres = parseFeetInches(trimmed.replace(/(\d),(?=\d{3}\b)/g, "$1"));
    return metres === null ? { ok: false, message: `Not a length in feet and inches: ${trimmed}` } : { ok: true, value: metres };
  }
  const grouped = groupedPattern.exec(trimmed);
  const numberText = grouped ? grouped[0] : numberPattern.exec(trimmed)?.[0];
  if (!numberText) return { ok: false, message: `Not a number: ${trimmed}` };
  const value = Number(numberText.replace(/,/g, ""));
  if (!Number.isFinite(value)) return { ok: false, message: `Not a finite number: ${trimmed}` };
  const rest = trimmed.slice(numberText.length);
  if (!rest.trim()) return { ok: true, value: fromDisplay(kind, value, system) };
  const k = quantityKinds[kind];
  const wanted = normaliseSymbol(rest);
  const unit = k.accepts.find((a) => a.symbol && normaliseSymbol(a.symbol) === wanted);
  if (!unit) {
    const known = [...new Set(k.accepts.map((a) => a.symbol).filter(Boolean))].join(", ");
    return { ok: false, message: `Unknown unit "${rest.trim()}" for ${k.label.toLowerCase()}${known ? ` (use ${known})` : ""}` };
  }
  return { ok: true, value: convertValue(value, unit, k.base) };
}
