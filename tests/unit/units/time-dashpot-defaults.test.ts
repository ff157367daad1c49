// Time and viscous dashpots in the chosen unit system, and default hints in a field's display
// unit. Expected figures worked by hand from the exact definitions (1 in = 0.0254 m,
// 1 ft = 0.3048 m, 1 lbf = 4.4482216152605 N, NIST SP 811 appendix B).
import { describe, expect, it } from "vitest";
import { CRITERIA_DEFAULTS } from "@/modules/calc";
import { formatDefault, formatQuantity, formatSignificant, fromDisplay, parseQuantity, toDisplay, unitSymbol } from "@/modules/units";

const lbfSPerIn = 4.4482216152605 / 0.0254; // 175.1268352... N·s/m
const kipFtSPerRad = 4448.2216152605 * 0.3048; // 1355.8179483... N·m·s/rad

describe("dashpot quantities", () => {
  it("show a translational dashpot in kN·s/m or lbf·s/in", () => {
    expect(unitSymbol("dashpot", "si")).toBe("kN·s/m");
    expect(unitSymbol("dashpot", "us")).toBe("lbf·s/in");
    expect(formatQuantity("dashpot", 1000 * lbfSPerIn, "us")).toBe("1,000.0 lbf·s/in");
    expect(formatQuantity("dashpot", 1000 * lbfSPerIn, "si")).toBe("175.1 kN·s/m");
    expect(formatSignificant(toDisplay("dashpot", 3.2e6, "si"))).toBe("3,200");
  });

  it("show a rotational dashpot in kN·m·s/rad or kip·ft·s/rad", () => {
    expect(formatQuantity("rotationalDashpot", 250 * kipFtSPerRad, "us")).toBe("250.00 kip·ft·s/rad");
    expect(formatQuantity("rotationalDashpot", 250 * kipFtSPerRad, "si")).toBe("339.0 kN·m·s/rad");
    expect(fromDisplay("rotationalDashpot", 1, "us")).toBeCloseTo(kipFtSPerRad, 9);
  });

  it("take a dashpot typed in another unit of the same dimension", () => {
    const r = parseQuantity("dashpot", "2 MN·s/m", "us");
    expect(r.ok && r.value).toBeCloseTo(2e6, 6);
    const k = parseQuantity("dashpot", "1 kip*s/in", "si");
    expect(k.ok && k.value).toBeCloseTo(1000 * lbfSPerIn, 6);
  });
});

describe("time", () => {
  it("is the second in both systems and takes milliseconds", () => {
    expect(formatQuantity("time", 12.5, "us")).toBe("12.50 s");
    expect(formatSignificant(toDisplay("time", 0.0004167, "si"))).toBe("4.17e-4");
    const r = parseQuantity("time", "250 ms", "si");
    expect(r.ok && r.value).toBeCloseTo(0.25, 12);
  });
});

describe("default hints in the field's display unit", () => {
  it("write the criteria defaults as a reader expects them", () => {
    expect(formatDefault("displacement", CRITERIA_DEFAULTS.maxDisplacementPeak.value, "si")).toBe("31.1 µm");
    expect(formatDefault("velocity", CRITERIA_DEFAULTS.maxVelocityPeak.value, "si")).toBe("1.98 mm/s");
    // 31.113 µm / 25.4 µm per mil = 1.2249; 1.9799 mm/s / 25.4 mm per in = 0.077949
    expect(formatDefault("displacement", CRITERIA_DEFAULTS.maxDisplacementPeak.value, "us")).toBe("1.22 mil");
    expect(formatDefault("velocity", CRITERIA_DEFAULTS.maxVelocityPeak.value, "us")).toBe("0.0779 in/s");
    expect(formatDefault("ratio", CRITERIA_DEFAULTS.minMassRatio.value, "si")).toBe("3");
    expect(formatDefault("ratio", CRITERIA_DEFAULTS.maxEccentricity.value, "us")).toBe("0.05");
  });
});
