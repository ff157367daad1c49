import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput } from "@/modules/calc";
import { checkKeyLabel, fieldLabel, listLeafPaths, parseFieldPath, withoutLongSeries } from "@/modules/revisions";

describe("fieldLabel", () => {
  it("names input fields in words", () => {
    expect(fieldLabel("soil.poissonRatio")).toBe("Soil · Poisson's ratio");
    expect(fieldLabel("soil.shearWaveVelocity")).toBe("Soil · shear-wave velocity");
    expect(fieldLabel("block.concreteDensity")).toBe("Block · concrete density");
    expect(fieldLabel('machines["Motor RWM-101"].rotors["rotor"].mass')).toBe("Machine Motor RWM-101 · rotor rotor · mass");
    expect(fieldLabel('machines["Raw-water pump RWP-101"].cg[2]')).toBe("Machine Raw-water pump RWP-101 · centre of gravity z");
    expect(fieldLabel('machines["Motor RWM-101"].rotors["rotor"].bearings[1][0]')).toBe("Machine Motor RWM-101 · rotor rotor · bearing 2 x");
    expect(fieldLabel('block.solids["mat"].x[1]')).toBe("Block · solid mat · x to");
    expect(fieldLabel('checkPoints["coupling"].position[0]')).toBe("Check point coupling · position x");
  });

  it("names a check by its kind, soil bound, machine and mode, not by its key", () => {
    expect(fieldLabel('checks["frequency-separation@soil-upper/Motor RWM-101/rotor/mode-1"].value')).toBe(
      "Check · frequency separation at the upper soil bound, Motor RWM-101 rotor, mode 1",
    );
    expect(fieldLabel('checks["frequency-separation/Motor RWM-101/rotor/mode-2"].limit')).toBe("Check · frequency separation, Motor RWM-101 rotor, mode 2 · limit");
    expect(fieldLabel('checks["mass-ratio"].value')).toBe("Check · mass ratio");
    expect(fieldLabel('checks["eccentricity/x"].value')).toBe("Check · eccentricity, x");
    expect(checkKeyLabel("velocity@soil-lower/Motor RWM-101/rotor/vertical/static/coupling")).toBe("velocity at the lower soil bound, Motor RWM-101 rotor, vertical static unbalance, at coupling");
  });

  it("names result values", () => {
    expect(fieldLabel("modes[0].frequencyHz")).toBe("Mode 1 · frequency");
    expect(fieldLabel('rotors["Motor RWM-101 / rotor"].cases["vertical / static"].points["coupling"].displacementPeak[0]')).toBe(
      "Response Motor RWM-101 / rotor · case vertical / static · point coupling · peak displacement x",
    );
  });

  it("returns a path it cannot read unchanged, and labels every leaf of a real revision without leaking brackets", () => {
    expect(fieldLabel("")).toBe("");
    expect(fieldLabel("[0].x")).toBe("[0].x");
    expect(fieldLabel('soil["unterminated')).toBe('soil["unterminated');
    expect(parseFieldPath('a["b\\"c"][2].d')).toEqual([
      { kind: "name", name: "a" },
      { kind: "key", key: 'b"c' },
      { kind: "index", index: 2 },
      { kind: "name", name: "d" },
    ]);
    const parsed = parseAnalysisInput(JSON.parse(readFileSync(path.join(process.cwd(), "examples", "raw-water-pump-train.json"), "utf8")));
    if (!parsed.ok) throw new Error("example does not parse");
    const paths = [...listLeafPaths(parsed.input), ...listLeafPaths(withoutLongSeries(analyse(parsed.input)))].map((p) => p.path);
    expect(paths.length).toBeGreaterThan(100);
    for (const p of paths) {
      const label = fieldLabel(p);
      expect(label, p).not.toMatch(/[[\]"]/);
      expect(label, p).not.toMatch(/[a-z][A-Z]/);
    }
  });
});

describe("labels of springs on a base block (engine 1.8.0)", () => {
  it("names the base's inputs and results in the trade's words", () => {
    expect(fieldLabel("impedance.base.z[1]")).toBe("Soil springs · base block under the springs · z to");
    expect(fieldLabel("impedance.base.support.method")).toBe("Soil springs · base block under the springs · soil under the base · method");
    expect(fieldLabel("springs.base.staticBearingPressure")).toBe("Springs · base block · static bearing pressure");
    expect(fieldLabel("springs.base.rotors[0].cases[1].groundForce[2]")).toMatch(/force into the ground z$/);
  });
});
