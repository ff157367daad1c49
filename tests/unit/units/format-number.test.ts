// The one number formatter (issue 14 item 2): engineering significant figures on known values,
// and the Excel format that shows the same figures in a workbook cell.
import { describe, expect, it } from "vitest";
import { formatSignificant, significantDecimals, significantExcelFormat } from "@/modules/units";

describe("formatSignificant", () => {
  it.each([
    [0.004218, "0.00422"],
    [3.5, "3.50"],
    [0.003818, "0.00382"],
    [0.2, "0.200"],
    [0.6, "0.600"],
    [8.49675e-7, "8.50e-7"],
    [-8.49675e-7, "-8.50e-7"],
    [1.98, "1.98"],
    [31.1, "31.1"],
    [12345.6, "12,346"],
    [7.010400000000001, "7.01"],
    [0.0999, "0.0999"],
    [0.09996, "0.100"],
    [999.6, "1,000"],
    [0.001, "0.00100"],
    [0.0009996, "1.00e-3"],
    [2.5e9, "2.50e9"],
    [0, "0"],
  ])("%s -> %s", (v, text) => {
    expect(formatSignificant(v)).toBe(text);
  });

  it("four figures on request, never 0.00 for a non-zero value", () => {
    expect(formatSignificant(0.004218, { digits: 4 })).toBe("0.004218");
    expect(formatSignificant(1.0231, { digits: 4 })).toBe("1.023");
    for (const v of [1e-12, 3e-9, 4.9e-4, 0.0049, 0.049]) expect(Number(formatSignificant(v).replace(/,/g, ""))).not.toBe(0);
    expect(formatSignificant(Number.NaN)).toBe("—");
  });
});

describe("significantExcelFormat", () => {
  it("fixed decimals for the value, scientific for the very small or large", () => {
    expect(significantExcelFormat(0.004218)).toBe("#,##0.00000");
    expect(significantExcelFormat(3.5)).toBe("#,##0.00");
    expect(significantExcelFormat(12345.6)).toBe("#,##0");
    expect(significantExcelFormat(8.49675e-7)).toBe("0.00E+00");
    expect(significantExcelFormat(0)).toBe("0");
  });
});

describe("formatSignificant with kept formatters (issue 15)", () => {
  it("reads exactly as Number.prototype.toLocaleString with the same options", () => {
    // ECMA-402: toLocaleString(locales, options) formats with a new Intl.NumberFormat(locales, options).
    const values = [0.001, 0.00423, 0.0999, 0.1, 1, 3.5, 9.995, 12.3456, 999.5, 12345.6, 999_499, -0.0421, -87.65, 2.675, 1.005];
    for (const v of values) {
      for (const digits of [3, 4] as const) {
        const decimals = significantDecimals(v, digits);
        for (const grouping of [true, false]) {
          const direct = v.toLocaleString("en-US", { minimumFractionDigits: decimals, maximumFractionDigits: decimals, useGrouping: grouping });
          expect(formatSignificant(v, { digits, grouping })).toBe(direct);
        }
      }
    }
  });
});
