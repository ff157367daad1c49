import { describe, expect, it } from "vitest";
import type { MachineInput } from "@/modules/calc/schema";
import { diffMachines } from "@/modules/vendor-data/diff";

const pump: MachineInput = {
  name: "Pump P-1",
  mass: 14000,
  cg: [1.5, 0, 2],
  rotors: [{ name: "impeller", mass: 980, speedRpm: 1785, balanceGrade: 6.3, serviceFactor: 2, axis: "x", unbalanceMode: "static", bearings: [[0.6, 0, 2.2], [2.5, 0, 2.2]] }],
};

describe("submission diff", () => {
  it("lists a changed rotor mass with old, new, change and per cent, and nothing else", () => {
    const next: MachineInput = { ...pump, rotors: [{ ...pump.rotors[0]!, mass: 1100 }] };
    const changes = diffMachines([pump], [next]);
    expect(changes).toHaveLength(1);
    expect(changes[0]).toMatchObject({ where: "Pump P-1 › impeller › rotor mass", unit: "kg", kind: "changed", before: 980, after: 1100, delta: 120 });
    expect(changes[0]?.percent).toBeCloseTo(12.245, 2);
  });

  it("ignores differences within the numeric tolerance and matches machines by name, not order", () => {
    const motor: MachineInput = { ...pump, name: "Motor M-1", rotors: [] };
    expect(diffMachines([pump, motor], [motor, { ...pump, mass: 14000 * (1 + 1e-12) }])).toEqual([]);
  });

  it("lists added and removed machines, rotors and bearings", () => {
    const changes = diffMachines([pump], [{ ...pump, rotors: [{ ...pump.rotors[0]!, bearings: [[0.6, 0, 2.2]] }] }, { ...pump, name: "Pump P-2" }]);
    expect(changes.filter((c) => c.kind === "removed").map((c) => c.where)).toEqual(["Pump P-1 › impeller › bearing 2 x", "Pump P-1 › impeller › bearing 2 y", "Pump P-1 › impeller › bearing 2 z"]);
    expect(changes.find((c) => c.kind === "added")).toMatchObject({ where: "machine Pump P-2", after: "Pump P-2" });
  });
});
