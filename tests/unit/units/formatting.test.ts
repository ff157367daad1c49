// Text shown and typed: fixed decimals per kind, units after the number, feet and inches.
import { describe, expect, it } from "vitest";
import { defineQuantityKind, formatFeetInches, formatNumber, formatQuantity, parseFeetInches, parseQuantity, units } from "@/modules/units";

describe("formatQuantity", () => {
  it("shows the system's unit with the kind's decimals and thousands grouped", () => {
    expect(formatQuantity("pressure", 150_000, "si")).toBe("150.0 kPa");
    expect(formatQuantity("pressure", 150_000, "us")).toBe("3,133 psf");
    expect(formatQuantity("length", 0.3048, "us")).toBe("1.000 ft");
    expect(formatQuantity("length", 6, "si")).toBe("6.000 m");
    expect(formatQuantity("largeMass", 6000, "us")).toBe("13.23 kip");
    expect(formatQuantity("displacement", 5.0e-5, "si")).toBe("50.0 µm");
    expect(formatQuantity("stiffness", 1.751268e8, "us")).toBe("1,000.0 kip/in");
    expect(formatQuantity("speed", 1180, "us")).toBe("1,180 rpm");
  });

  it("can leave out the unit and the grouping, for entry fields", () => {
    expect(formatQuantity("force", 12_345, "si", { withUnit: false, grouping: false })).toBe("12345");
    expect(formatQuantity("ratio", 0.33, "si")).toBe("0.330");
  });

  it("keeps three significant digits of a small value rather than showing zero", () => {
    expect(formatNumber(3.2e-6, 1)).toBe("0.00000320");
    expect(formatNumber(0, 2)).toBe("0.00");
    expect(formatNumber(-0, 2)).toBe("0.00");
    expect(formatNumber(Number.NaN, 2)).toBe("—");
  });
});

describe("feet and inches", () => {
  it("formats metres as feet and decimal inches", () => {
    expect(formatFeetInches(1.6764)).toBe(`5' 6"`);
    expect(formatFeetInches(-0.3175)).toBe(`-1' 0.5"`);
    expect(formatFeetInches(0.3048 * 3 - 0.0001)).toBe(`3' 0"`); // rounds up into the next foot
    expect(formatFeetInches(0)).toBe(`0' 0"`);
  });

  it("parses the ways people write them", () => {
    expect(parseFeetInches(`5' 6"`)).toBeCloseTo(1.6764, 12);
    expect(parseFeetInches("5 ft 6 in")).toBeCloseTo(1.6764, 12);
    expect(parseFeetInches(`-2'`)).toBeCloseTo(-0.6096, 12);
    expect(parseFeetInches(`7.5"`)).toBeCloseTo(0.1905, 12);
    expect(parseFeetInches("five feet")).toBeNull();
  });
});

describe("parseQuantity", () => {
  it("takes a bare number in the system's unit", () => {
    expect(parseQuantity("pressure", "150", "si")).toEqual({ ok: true, value: 150_000 });
    const psf = parseQuantity("pressure", "1,250", "us");
    expect(psf.ok && psf.value).toBeCloseTo(1250 * 47.88025898033584, 8);
    expect(parseQuantity("modulus", "6e1", "si")).toEqual({ ok: true, value: 6.0e7 });
  });

  it("takes a number in any unit the kind accepts, whatever the system", () => {
    expect(parseQuantity("pressure", "150 kPa", "us")).toEqual({ ok: true, value: 150_000 });
    const stiff = parseQuantity("stiffness", "100 kip/in", "si");
    expect(stiff.ok && stiff.value).toBeCloseTo(1.7512683524647637e7, 6);
    const rot = parseQuantity("rotationalStiffness", "1000 kip*ft/rad", "si");
    expect(rot.ok && rot.value).toBeCloseTo(1.3558179483314e6, 6);
    const disp = parseQuantity("displacement", "2 mil", "si");
    expect(disp.ok && disp.value).toBeCloseTo(5.08e-5, 15);
    expect(parseQuantity("displacement", "50 um", "us")).toMatchObject({ ok: true });
    const density = parseQuantity("density", "2400 kg/m3", "us");
    expect(density).toEqual({ ok: true, value: 2400 });
    const length = parseQuantity("length", `12' 6"`, "si");
    expect(length.ok && length.value).toBeCloseTo(3.81, 12);
    expect(parseQuantity("length", "450 mm", "us")).toEqual({ ok: true, value: 0.45 });
  });

  it("explains what it cannot read", () => {
    expect(parseQuantity("length", "", "si")).toEqual({ ok: false, message: "Enter a number" });
    expect(parseQuantity("length", "abc", "si")).toMatchObject({ ok: false, message: "Not a number: abc" });
    const wrong = parseQuantity("pressure", "3 furlongs", "si");
    expect(wrong.ok).toBe(false);
    if (!wrong.ok) expect(wrong.message).toMatch(/Unknown unit "furlongs" for pressure \(use Pa, kPa, psf/);
  });
});

describe("defineQuantityKind", () => {
  it("reduces safe-units units to symbols and SI sizes", () => {
    const kind = defineQuantityKind({ label: "Dashpot", base: units.newtonPerMetre, si: units.meganewtonPerMetre, us: units.kipPerInch, decimals: { si: 1, us: 1 } });
    expect(kind.si).toEqual({ symbol: "MN/m", siValue: 1e6 });
    expect(kind.accepts.map((a) => a.symbol)).toEqual(["N/m", "MN/m", "kip/in"]);
    // Mixing dimensions is a compile error (checked by `tsc --noEmit`):
    // @ts-expect-error psf is a pressure, not a stiffness
    defineQuantityKind({ label: "Wrong", base: units.newtonPerMetre, si: units.meganewtonPerMetre, us: units.poundPerSquareFoot, decimals: { si: 1, us: 1 } });
  });
});
