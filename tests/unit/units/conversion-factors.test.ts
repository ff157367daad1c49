// Conversion factors against NIST Special Publication 811 (2008 edition), appendix B.8/B.9.
// "Exact" factors are definitions (1 in = 0.0254 m, 1 lb = 0.45359237 kg, g_n = 9.80665 m/s²);
// the others are SP 811's 7-significant-digit values.
import { describe, expect, it } from "vitest";
import { fromDisplay, quantityKinds, toDisplay, type QuantityKindKey } from "@/modules/units";

const FT = 0.3048; // m, exact
const IN = 0.0254; // m, exact
const LB = 0.45359237; // kg, exact
const LBF = LB * 9.80665; // N, exact: 4.4482216152605

/** SI size of one display unit: fromDisplay(kind, 1, system) in the kind's stored unit. */
const sizeOfUs = (kind: QuantityKindKey) => fromDisplay(kind, 1, "us") * quantityKinds[kind].base.siValue;

function expectRelative(actual: number, expected: number, tolerance: number) {
  expect(Math.abs(actual - expected) / Math.abs(expected)).toBeLessThanOrEqual(tolerance);
}

describe("exact definitions (to the last bits of a double)", () => {
  it.each([
    ["1 ft = 0.3048 m", "length", FT],
    ["1 ft² = 9.290304E-02 m²", "area", FT * FT],
    ["1 yd³ = 7.645549E-01 m³ (27 ft³)", "volume", 27 * FT * FT * FT],
    ["1 mil = 2.54E-05 m", "displacement", 0.001 * IN],
    ["1 in/s = 2.54E-02 m/s", "velocity", IN],
    ["1 ft/s = 0.3048 m/s", "waveSpeed", FT],
    ["1 lb = 0.45359237 kg", "mass", LB],
    ["1000 lb = 453.59237 kg", "largeMass", 1000 * LB],
    ["1 lbf = 4.4482216152605 N", "force", LBF],
    ["1 kip = 4448.2216152605 N", "largeForce", 1000 * LBF],
  ] as const)("%s", (_label, kind, expected) => {
    expectRelative(sizeOfUs(kind), expected, 1e-15);
  });

  it("gives the lbf of NIST SP 811 to all its published digits", () => {
    expect(fromDisplay("force", 1, "us")).toBeCloseTo(4.4482216152605, 13);
  });
});

describe("derived factors against SP 811's rounded values", () => {
  it.each([
    ["1 lbf/ft² (psf) = 4.788026E+01 Pa", "pressure", 4.788026e1],
    ["1 kip/ft² (ksf) = 4.788026E+04 Pa", "modulus", 4.788026e4],
    ["1 lb/ft³ (pcf) = 1.601846E+01 kg/m³", "density", 1.601846e1],
    ["1 kip/in = 1.751268E+05 N/m (lbf/in = 1.751268E+02 N/m)", "stiffness", 1.751268e5],
    ["1 kip·ft/rad = 1.355818E+03 N·m/rad (lbf·ft = 1.355818 N·m)", "rotationalStiffness", 1.355818e3],
    ["1 lb·ft² = 4.214011E-02 kg·m²", "massInertia", 4.214011e-2],
  ] as const)("%s", (_label, kind, published) => {
    // Seven significant digits: within half a unit of the last one.
    expectRelative(sizeOfUs(kind), published, 5e-7);
  });

  it("composes the derived factors exactly from the definitions", () => {
    expectRelative(sizeOfUs("pressure"), LBF / (FT * FT), 1e-15);
    expectRelative(sizeOfUs("modulus"), (1000 * LBF) / (FT * FT), 1e-15);
    expectRelative(sizeOfUs("density"), LB / FT ** 3, 1e-15);
    expectRelative(sizeOfUs("stiffness"), (1000 * LBF) / IN, 1e-15);
    expectRelative(sizeOfUs("rotationalStiffness"), 1000 * LBF * FT, 1e-15);
  });
});

describe("SI display units", () => {
  it("shows the stored SI value in the SI display unit", () => {
    expect(toDisplay("pressure", 150_000, "si")).toBe(150); // Pa -> kPa
    expect(toDisplay("modulus", 6.0e7, "si")).toBe(60); // Pa -> MPa
    expect(toDisplay("displacement", 5.0e-5, "si")).toBeCloseTo(50, 12); // m -> µm
    expect(toDisplay("velocity", 3.0e-3, "si")).toBeCloseTo(3, 12); // m/s -> mm/s
    expect(toDisplay("largeMass", 6000, "si")).toBe(6); // kg -> t
    expect(toDisplay("stiffness", 2.5e8, "si")).toBe(250); // N/m -> MN/m
    expect(toDisplay("largeForce", 1500, "si")).toBe(1.5); // N -> kN
  });

  it("leaves kinds that both systems show alike untouched, to the bit", () => {
    for (const kind of ["speed", "frequency", "ratio", "balanceGrade"] as const) {
      for (const value of [1180, 13.381424792834373, 0.33, 6.3]) {
        expect(toDisplay(kind, value, "us")).toBe(value);
        expect(fromDisplay(kind, value, "si")).toBe(value);
      }
    }
  });

  it("keeps the balance grade in mm/s in both systems (ISO 1940-1 states G in mm/s)", () => {
    expect(quantityKinds.balanceGrade.us.symbol).toBe("mm/s");
    expect(toDisplay("balanceGrade", 6.3, "us")).toBe(6.3);
  });
});

describe("US display of typical foundation values", () => {
  it("converts a bearing pressure, a shear modulus, a density and a displacement limit", () => {
    expect(toDisplay("pressure", 150_000, "us")).toBeCloseTo(150_000 / (LBF / FT ** 2), 9); // ≈ 3132.8 psf
    expect(toDisplay("modulus", 6.0e7, "us")).toBeCloseTo(6.0e7 / ((1000 * LBF) / FT ** 2), 9); // ≈ 1253.1 ksf
    expect(toDisplay("density", 2400, "us")).toBeCloseTo(149.8271, 4); // pcf
    expect(toDisplay("displacement", 5.0e-5, "us")).toBeCloseTo(1.968504, 6); // mil
    expect(toDisplay("velocity", 3.0e-3, "us")).toBeCloseTo(0.1181102, 7); // in/s
  });
});
