// The one number formatter for results: the desk's result tables, the calculation
// package's workbook cells (as Excel number formats) and its PDF all go through here, so
// every rendition reads alike.
//
// The rule (significant figures suited to engineering results):
// - 3 significant figures by default (4 on request); trailing zeros kept, so 3.5 reads
//   "3.50" and the reader sees the precision;
// - the integer part is never rounded away: 12 345.6 reads "12,346", not "12,300";
// - a non-zero value never reads 0 or 0.00: below 0.001 (and from 1e6 up) the value is
//   written in scientific notation with a lower-case e and no padded exponent,
//   8.49675e-7 -> "8.50e-7" (the form a programmer and an engineer both read);
// - zero reads "0"; NaN and infinities read "—".
// Input values arrive in the unit they are to be shown in (the caller converts first).

export interface SignificantOptions {
  /** Significant figures, 3 (default) or 4. */
  digits?: 3 | 4;
  /** Group thousands with commas (default true). */
  grouping?: boolean;
}

/** Below this magnitude, and from SCI_LARGE up, values are written in scientific notation. */
export const SCI_SMALL = 1e-3;
export const SCI_LARGE = 1e6;

/** Decimals that give `digits` significant figures for a value in fixed notation (0 for large values). */
export function significantDecimals(value: number, digits: 3 | 4 = 3): number {
  if (value === 0 || !Number.isFinite(value)) return 0;
  // Round first, so 0.0999 at 3 figures (which rounds to 0.100) gets 3 decimals, not 4.
  const rounded = Number(Math.abs(value).toPrecision(digits));
  return Math.max(0, digits - 1 - Math.floor(Math.log10(rounded)));
}

function scientific(value: number, digits: number): boolean {
  const abs = Math.abs(value);
  return abs !== 0 && (abs < SCI_SMALL || Number(abs.toPrecision(digits)) >= SCI_LARGE);
}

/** A result as text with engineering significant figures, e.g. 0.004218 -> "0.00422", 3.5 -> "3.50", 8.49675e-7 -> "8.50e-7". */
export function formatSignificant(value: number, options: SignificantOptions = {}): string {
  if (!Number.isFinite(value)) return "—";
  const digits = options.digits ?? 3;
  if (value === 0) return "0";
  if (scientific(value, digits)) {
    const [mantissa = "", exponent = "0"] = value.toExponential(digits - 1).split("e");
    return `${mantissa}e${Number(exponent)}`;
  }
  return fixedFormatter(significantDecimals(value, digits), options.grouping ?? true).format(value);
}

// ECMA-402 defines Number.prototype.toLocaleString(locales, options) as formatting with a new
// Intl.NumberFormat(locales, options): the same text, but building the formatter on every call
// cost ~0.1 ms each, a workspace keystroke formats thousands of figures (issue 15), so one
// formatter per (decimals, grouping) is kept.
const fixedFormatters = new Map<string, Intl.NumberFormat>();
/** The en-US formatter with exactly `decimals` fraction digits (shared, built once per kind). */
export function fixedFormatter(decimals: number, grouping: boolean): Intl.NumberFormat {
  const key = `${decimals}:${grouping ? 1 : 0}`;
  let f = fixedFormatters.get(key);
  if (!f) {
    f = new Intl.NumberFormat("en-US", { minimumFractionDigits: decimals, maximumFractionDigits: decimals, useGrouping: grouping });
    fixedFormatters.set(key, f);
  }
  return f;
}

/**
 * The Excel number format that shows a cell's value as formatSignificant does: fixed
 * decimals chosen for that value ("#,##0.00"), or a scientific format ("0.00E+00", which
 * Excel writes as 8.50E-07) for very small or large values. The cell keeps the full value.
 */
export function significantExcelFormat(value: number, digits: 3 | 4 = 3): string {
  if (!Number.isFinite(value) || value === 0) return "0";
  if (scientific(value, digits)) return `0.${"0".repeat(digits - 1)}E+00`;
  const decimals = significantDecimals(value, digits);
  return decimals === 0 ? "#,##0" : `#,##0.${"0".repeat(decimals)}`;
}
