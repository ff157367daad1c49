import { describe, expect, it } from "vitest";
import type { MachineInput } from "@/modules/calc/schema";
import { axisToBlock, blockToDatum, datumToBlock, machineToBlock, machineToDatum, type MachineDatum } from "@/modules/vendor-data/datum";

// Hand-checked by p_block = origin + Rz(θ) p_machine with cos/sin of the quarter turns
// (a rotation about z, counter-clockwise seen from above): the numbers below were worked on paper.
const origin: [number, number, number] = [1.5, -0.4, 1.8];
const at = (rotationDeg: MachineDatum["rotationDeg"]): MachineDatum => ({ origin, rotationDeg });
const p = [2.0, 0.3, -0.5];

function close(actual: number[], expected: number[]) {
  expect(actual).toHaveLength(expected.length);
  actual.forEach((v, i) => expect(v).toBeCloseTo(expected[i] ?? NaN, 12));
}

describe("machine datum to block coordinates", () => {
  it("0°: a shift only", () => close(datumToBlock(at(0), p), [3.5, -0.1, 1.3]));
  it("90°: machine x along block y, machine y along block -x", () => close(datumToBlock(at(90), p), [1.2, 1.6, 1.3]));
  it("180°: machine x along block -x", () => close(datumToBlock(at(180), p), [-0.5, -0.7, 1.3]));
  it("270°: machine x along block -y", () => close(datumToBlock(at(270), p), [1.8, -2.4, 1.3]));

  it("the datum's own origin lands on the placed origin, with no -0 left over", () => {
    for (const r of [0, 90, 180, 270] as const) {
      const o = datumToBlock({ origin: [0, 0, 0], rotationDeg: r }, [0, 0, 0]);
      expect(o.map((v) => Object.is(v, -0))).toEqual([false, false, false]);
      close(datumToBlock(at(r), [0, 0, 0]), origin);
    }
  });

  it("blockToDatum undoes datumToBlock at every rotation", () => {
    for (const r of [0, 90, 180, 270] as const) close(blockToDatum(at(r), datumToBlock(at(r), p)), p);
  });

  it("a quarter turn swaps the horizontal shaft axes; a vertical shaft stays vertical", () => {
    expect([0, 90, 180, 270].map((r) => axisToBlock(at(r as MachineDatum["rotationDeg"]), "x"))).toEqual(["x", "y", "x", "y"]);
    expect(axisToBlock(at(90), "z")).toBe("z");
  });

  it("a whole machine: centre of gravity, outline box (ranges swapped and flipped), bearings and shaft axis", () => {
    const vendor: MachineInput = {
      name: "Pump",
      mass: 3000,
      cg: [1.2, 0, -0.3],
      box: { x: [-0.5, 2.5], y: [-0.6, 0.6], z: [-0.9, 0.8] },
      rotors: [{ name: "Impeller", mass: 400, speedRpm: 1480, serviceFactor: 2, axis: "x", unbalanceMode: "static", balanceGrade: 6.3, bearings: [[0.4, 0, 0], [2.1, 0, 0]] }],
    };
    const datum: MachineDatum = { origin: [0, 0, 1], rotationDeg: 90 };
    const block = machineToBlock(datum, vendor);
    close(block.cg, [0, 1.2, 0.7]);
    expect(block.box?.x[0]).toBeCloseTo(-0.6, 12);
    expect(block.box?.x[1]).toBeCloseTo(0.6, 12);
    expect(block.box?.y).toEqual([-0.5, 2.5]);
    close(block.box?.z ?? [], [0.1, 1.8]);
    close(block.rotors[0]?.bearings[0] ?? [], [0, 0.4, 1]);
    close(block.rotors[0]?.bearings[1] ?? [], [0, 2.1, 1]);
    expect(block.rotors[0]?.axis).toBe("y");
    expect(block.mass).toBe(3000);
    expect(block.rotors[0]?.speedRpm).toBe(1480);
    // and back again
    const back = machineToDatum(datum, block);
    close(back.cg, vendor.cg);
    expect(back.rotors[0]?.axis).toBe("x");
    close(back.box?.x ?? [], vendor.box?.x ?? []);
  });
});
