// Display <-> stored conversions invert each other for every kind and both systems, and
// what formatQuantity prints parses back to the value it showed.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { formatQuantity, fromDisplay, parseQuantity, quantityKindKeys, quantityKinds, toDisplay } from "@/modules/units";

const systems = ["si", "us"] as const;
const finiteValue = fc.double({ min: -1e12, max: 1e12, noNaN: true, noDefaultInfinity: true }).filter((v) => Math.abs(v) > 1e-12);

describe("round trips", () => {
  it("fromDisplay(toDisplay(x)) is x to 1e-14 relative, for every kind and system", () => {
    fc.assert(
      fc.property(fc.constantFrom(...quantityKindKeys), fc.constantFrom(...systems), finiteValue, (kind, system, x) => {
        const back = fromDisplay(kind, toDisplay(kind, x, system), system);
        expect(Math.abs(back - x) / Math.abs(x)).toBeLessThanOrEqual(1e-14);
      }),
      { numRuns: 2000 },
    );
  });

  it("SI -> US -> SI through the other system's entry is the same value", () => {
    fc.assert(
      fc.property(fc.constantFrom(...quantityKindKeys), finiteValue, (kind, x) => {
        const typedInUs = toDisplay(kind, x, "us");
        const shownInSi = toDisplay(kind, fromDisplay(kind, typedInUs, "us"), "si");
        expect(Math.abs(shownInSi - toDisplay(kind, x, "si")) / Math.abs(toDisplay(kind, x, "si"))).toBeLessThanOrEqual(1e-14);
      }),
    );
  });

  it("parses what it formats back to the shown precision", () => {
    fc.assert(
      fc.property(fc.constantFrom(...quantityKindKeys), fc.constantFrom(...systems), fc.double({ min: 1e-3, max: 1e9, noNaN: true }), (kind, system, x) => {
        const stored = fromDisplay(kind, x, system);
        const text = formatQuantity(kind, stored, system, { decimals: 6 });
        const parsed = parseQuantity(kind, text, system);
        expect(parsed.ok).toBe(true);
        if (parsed.ok) expect(toDisplay(kind, parsed.value, system)).toBeCloseTo(Number(x.toFixed(6)), 5);
      }),
    );
  });

  it("has no two units of one kind that read alike once typed loosely", () => {
    for (const kind of quantityKindKeys) {
      const bySymbol = new Map<string, number>();
      for (const unit of quantityKinds[kind].accepts) {
        const key = unit.symbol.toLowerCase().replace(/[·*\s]/g, "");
        const seen = bySymbol.get(key);
        if (seen !== undefined) expect(seen, `${kind}: ${unit.symbol}`).toBe(unit.siValue);
        bySymbol.set(key, unit.siValue);
      }
    }
  });
});
