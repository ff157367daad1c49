// Analysis inputs at and past the contract's limits (INPUT_LIMITS), built from the demo's raw-water
// pump train: the hostile input of issue 19 and the heaviest input the contract accepts. Shared
// by the unit, integration and browser suites and by `npm run bench`.
import { readFileSync } from "node:fs";
import path from "node:path";
import { INPUT_LIMITS, TRANSIENT_LIMITS } from "../../modules/calc";

type Doc = Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any

const EXAMPLE = path.join(import.meta.dirname, "../../examples/raw-water-pump-train.json");

export function pumpTrainInput(): Doc {
  return JSON.parse(readFileSync(EXAMPLE, "utf8")) as Doc;
}

/** The probe's input: the example plus 2,000 check points and 10,000 sweep points (72 KB). */
export function hostileInput(): Doc {
  const doc = pumpTrainInput();
  doc.checkPoints = Array.from({ length: 2000 }, (_, i) => ({ name: `probe point ${i + 1}`, position: [0.001 * i, 0, 1] }));
  doc.sweep = { ...doc.sweep, points: 10_000 };
  return doc;
}

/**
 * Every list at its maximum where the result's size allows it: all rotors on the largest
 * machines with both unbalance modes, the most bearings and check points, the sweep points that
 * the output budget then leaves, the most solids, and the most start-up and coast-down runs at the
 * longest duration and finest output.
 */
export function worstAcceptedInput(): Doc {
  const L = INPUT_LIMITS;
  const doc = pumpTrainInput();
  const template = doc.machines[0];
  const rotorTemplate = template.rotors[0];
  const machines = L.maxRotors / L.maxRotorsPerMachine;
  const z = template.cg[2];
  doc.machines = Array.from({ length: machines }, (_, m) => ({
    ...template,
    name: `machine ${m + 1}`,
    rotors: Array.from({ length: L.maxRotorsPerMachine }, (_, r) => ({
      ...rotorTemplate,
      name: `rotor ${r + 1}`,
      mass: template.mass / (2 * L.maxRotorsPerMachine),
      unbalanceMode: "both",
      bearings: Array.from({ length: L.maxBearingsPerRotor }, (_, b) => [-1 + (2 * b) / (L.maxBearingsPerRotor - 1), 0.1 * m, z]),
    })),
  }));
  doc.checkPoints = Array.from({ length: L.maxCheckPoints }, (_, i) => ({ name: `point ${i + 1}`, position: [0.05 * i, 0, 1] }));
  const series = L.maxRotors * 6 * (L.maxBearingsPerRotor + L.maxCheckPoints);
  doc.sweep = { ...doc.sweep, points: Math.floor(L.maxSweepValues / series) };
  // the mat cut into strips along x: the same block, the most solids
  const solids = doc.block.solids as { name: string; x: [number, number]; y: [number, number]; z: [number, number] }[];
  const mat = solids[0]!;
  const strips = L.maxSolids - (solids.length - 1);
  const width = (mat.x[1] - mat.x[0]) / strips;
  doc.block.solids = [
    ...Array.from({ length: strips }, (_, i) => ({ ...mat, name: `${mat.name} strip ${i + 1}`, x: [mat.x[0] + width * i, i === strips - 1 ? mat.x[1] : mat.x[0] + width * (i + 1)] })),
    ...solids.slice(1),
  ];
  doc.transient = Array.from({ length: L.maxTransientRuns }, (_, i) => ({
    machine: `machine ${1 + (i % machines)}`,
    rotor: `rotor ${1 + (i % L.maxRotorsPerMachine)}`,
    kind: i % 2 === 0 ? "run-up" : "coast-down",
    durationS: TRANSIENT_LIMITS.maxDurationS,
    unbalanceMode: "static",
    outputPoints: L.maxTransientOutputPoints,
  }));
  return doc;
}
