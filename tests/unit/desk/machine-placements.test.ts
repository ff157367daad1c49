import { describe, expect, it } from "vitest";
import type { MachineInput } from "@/modules/calc/schema";
import { formFromInput, placementsFromForm, withPlacements } from "@/modules/desk/draft-form";
import { prefillInVendorTerms, rampDurationFor, runDurationSource, takeVendorMachines, withStoredTrails, type MachinePlacement } from "@/modules/desk/machine-placements";
import { RAMP_TIME_DEFAULTS } from "@/modules/desk/rotor-defaults";

// A motor in its own datum (origin on the shaft centreline at the coupling face, x away from the coupling).
const vendorMotor: MachineInput = {
  name: "Motor",
  mass: 2000,
  cg: [0.8, 0, -0.2],
  rotors: [{ name: "Rotor", mass: 500, speedRpm: 1490, serviceFactor: 2, balanceGrade: 2.5, axis: "x", unbalanceMode: "static", bearings: [[0.3, 0, 0], [1.3, 0, 0]] }],
};
const SUB = "5b0c1f3a-0000-4000-8000-0000000000a1";
const submission = { id: SUB, version: 2, frame: "machine-datum" as const, machines: [vendorMotor], rampTimes: [{ machine: "Motor", rotor: "Rotor", startUpS: 7, coastDownS: 45 }] };

describe("taking vendor data into a draft through the machine datum", () => {
  it("converts through the placed datum (here 180°: hand-checked x' = 2.0 - x, y' = -y, z' = 1.5 + z) and keeps the vendor's values and the datum", () => {
    const datum = { origin: [2.0, 0, 1.5] as [number, number, number], rotationDeg: 180 as const };
    const taken = takeVendorMachines({ submission, requestedNames: ["Motor"], placements: [{ machine: "Motor", datum, vendor: null }], transient: undefined });
    expect(taken.ok).toBe(true);
    if (!taken.ok) return;
    const m = taken.machines[0]!;
    expect(m.cg[0]).toBeCloseTo(1.2, 12);
    expect(m.cg[1]).toBe(0);
    expect(m.cg[2]).toBeCloseTo(1.3, 12);
    expect(m.rotors[0]?.bearings.map((b) => b[0])).toEqual([1.7, 0.7]);
    expect(m.rotors[0]?.axis).toBe("x");
    expect(taken.placements).toEqual([{ machine: "Motor", datum, vendor: { submissionId: SUB, version: 2, frame: "machine-datum", machine: vendorMotor, rampTimes: [{ rotor: "Rotor", startUpS: 7, coastDownS: 45 }] } }]);
  });

  it("refuses, naming the machine, when its datum is not placed; takes a version 1 submission (block coordinates) as it is", () => {
    const refused = takeVendorMachines({ submission, requestedNames: ["Motor"], placements: [], transient: undefined });
    expect(refused).toEqual({ ok: false, issues: [{ path: "machines[0]", message: expect.stringMatching(/Place the datum of "Motor" on the block first/) }] });
    const v1 = takeVendorMachines({ submission: { ...submission, frame: "block", rampTimes: [] }, requestedNames: ["Motor"], placements: [], transient: undefined });
    expect(v1.ok && v1.machines[0]).toEqual(vendorMotor);
    expect(v1.ok && v1.placements[0]?.datum).toBeNull();
  });

  it("gives the vendor's times to the rotor's speed-ramp runs and leaves other runs alone", () => {
    const runs = [
      { machine: "Motor", rotor: "Rotor", kind: "run-up" as const, durationS: 10 },
      { machine: "Motor", rotor: "Rotor", kind: "coast-down" as const, durationS: 60 },
      { machine: "Pump", rotor: "Impeller", kind: "run-up" as const, durationS: 10 },
    ];
    const taken = takeVendorMachines({ submission, requestedNames: ["Motor"], placements: [{ machine: "Motor", datum: { origin: [0, 0, 1], rotationDeg: 0 }, vendor: null }], transient: runs });
    expect(taken.ok && taken.transient?.map((r) => r.durationS)).toEqual([7, 45, 10]);
    expect(taken.ok && taken.retimed).toBe(2);
  });

  it("says where a run's duration comes from: the vendor's time, or the desk's default with its source", () => {
    const placements: MachinePlacement[] = [{ machine: "Motor", datum: null, vendor: { submissionId: SUB, version: 2, frame: "machine-datum", machine: vendorMotor, rampTimes: [{ rotor: "Rotor", startUpS: 7 }] } }];
    expect(rampDurationFor(placements, "Motor", "Rotor", "run-up")).toMatchObject({ durationS: 7, from: "vendor", source: expect.stringMatching(/vendor's start-up time \(machine data version 2\)/) });
    expect(rampDurationFor(placements, "Motor", "Rotor", "coast-down")).toMatchObject({ durationS: RAMP_TIME_DEFAULTS.coastDownS.value, from: "desk-default", source: expect.stringContaining(RAMP_TIME_DEFAULTS.coastDownS.source) });
    expect(runDurationSource(placements, { machine: "Motor", rotor: "Rotor", kind: "run-up", durationS: 12 })).toBe("Duration set by the designer (the vendor gives 7 s)");
  });

  it("prefills a template in the vendor's terms: through the placed datum, or without positions when none is placed", () => {
    const datum = { origin: [2.0, 0, 1.5] as [number, number, number], rotationDeg: 180 as const };
    const block = takeVendorMachines({ submission, requestedNames: ["Motor"], placements: [{ machine: "Motor", datum, vendor: null }], transient: undefined });
    if (!block.ok) throw new Error("take-in failed");
    const [withDatum] = prefillInVendorTerms([{ name: "Motor", values: block.machines[0]! }], undefined, [{ machine: "Motor", datum }]);
    withDatum?.values?.cg.forEach((v, i) => expect(v).toBeCloseTo(vendorMotor.cg[i]!, 12));
    expect(prefillInVendorTerms([{ name: "Motor", values: block.machines[0]! }], undefined, [])[0]).toMatchObject({ omitPositions: true });
    // the newest submission in the datum's terms is prefilled as it is, with its times
    expect(prefillInVendorTerms([{ name: "Motor", values: null }], submission, [])[0]).toEqual({ name: "Motor", values: vendorMotor, rampTimes: submission.rampTimes });
  });

  it("a save keeps the designer's datums and only the vendor figures the server stored", () => {
    const stored: MachinePlacement[] = [{ machine: "Motor", datum: null, vendor: { submissionId: SUB, version: 2, frame: "machine-datum", machine: vendorMotor, rampTimes: [] } }];
    const forged = { ...vendorMotor, mass: 1 };
    const sent: MachinePlacement[] = [
      { machine: "Motor", datum: { origin: [1, 2, 3], rotationDeg: 90 }, vendor: { ...stored[0]!.vendor!, machine: { ...forged, name: "Motor" } } },
      { machine: "Other", datum: null, vendor: { ...stored[0]!.vendor!, submissionId: "5b0c1f3a-0000-4000-8000-0000000000ff" } },
    ];
    expect(withStoredTrails(sent, stored)).toEqual([{ machine: "Motor", datum: { origin: [1, 2, 3], rotationDeg: 90 }, vendor: stored[0]!.vendor }]);
  });

  it("the form carries datums by machine name and gives them back (existing drafts without one keep none)", () => {
    const form = formFromInput({ schemaVersion: 1, block: { concreteDensity: 2400, solids: [{ name: "Mat", x: [-2, 2], y: [-1, 1], z: [0, 1] }] }, soil: { poissonRatio: 0.3, density: 1900, allowableBearingPressure: 2e5, shearWaveVelocity: 200 }, impedance: { method: "equivalent-radius" }, machines: [vendorMotor] });
    expect(placementsFromForm(form)).toEqual([]);
    const placed = withPlacements(form, [{ machine: "Motor", datum: { origin: [0.5, 0, 1], rotationDeg: 270 }, vendor: null }]);
    expect(placementsFromForm(placed)).toEqual([{ machine: "Motor", datum: { origin: [0.5, 0, 1], rotationDeg: 270 }, vendor: null }]);
    // a datum with a blank coordinate is not a placement yet
    const blank = { ...placed, machines: placed.machines.map((m) => ({ ...m, datum: { placed: true, origin: [0.5, null, 1] as [number, null, number], rotationDeg: 0 as const } })) };
    expect(placementsFromForm(blank)).toEqual([]);
  });
});
