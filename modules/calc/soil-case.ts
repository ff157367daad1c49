// One complete dynamic analysis of the model at one soil stiffness: impedance, undamped modes
// and the rotor responses. The nominal case uses factor 1; the soil band repeats it.
import { dofFromArray } from "./dof";
import { naturalModes, type Mode } from "./eigen";
import { HarmonicSolver } from "./harmonic";
import { buildImpedance } from "./impedance";
import { evaluateImpedanceMatrix, offDiagonalTerms, ratioFromDashpot, type ImpedanceModel } from "./impedance-model";
import { DOF_KEYS } from "./dof";
import type { Model } from "./model";
import { combinedResults } from "./combination";
import type { CombinedResult, ImpedanceResult, RotorResult } from "./result-types";
import { rotorResults } from "./rotor-response";
import { soilProperties, type SoilProperties } from "./soil";
import { twoStageModes } from "./two-stage";

export interface SoilCase {
  factor: number;
  soil: SoilProperties;
  impedance: ImpedanceModel;
  impedanceResult: ImpedanceResult;
  /** Diagonal of K and C at the evaluation frequency (first rotor's rated speed, 0 without rotors). */
  stiffnessUsed: Float64Array;
  dashpotUsed: Float64Array;
  /** Full K and C there, row-major 6 x 6 (off-diagonal zeros for a diagonal method). */
  stiffnessMatrix: Float64Array;
  dashpotMatrix: Float64Array;
  modes: Mode[];
  rotors: RotorResult[];
  /** Rotors responding together (combination.ts); empty with fewer than two rotors. */
  combined: CombinedResult[];
  solver: HarmonicSolver;
}

export function runSoilCase(model: Model, factor: number): SoilCase {
  const input = model.input;
  // Soil methods: the factor scales G; user and steel springs: it scales the stiffness (impedance.ts).
  const springMethod = input.impedance.method === "user" || input.impedance.method === "springs";
  const soilNominal = soilProperties(input.soil, springMethod ? 1 : factor);
  // steel springs carry no soil hysteresis: their damping is the dampers' or the ratio given
  const soil = input.impedance.method === "springs" ? { ...soilNominal, materialDamping: 0 } : soilNominal;
  // springs on a base block: the soil under the base takes the band's factor in G (soil methods) and keeps its material damping
  const baseBlock = model.baseBlock ? { model: model.baseBlock, soil: soilProperties(input.soil, factor), upperMass: model.massMatrix } : undefined;
  const impedance = buildImpedance(
    input.impedance,
    { soil, base: model.base, massDiagonal: model.massDiagonal, origin: [model.origin[0], model.origin[1]], ...(baseBlock ? { baseBlock } : {}) },
    factor,
  );
  const omega1 = model.rotors[0]?.omegaRated ?? 0;
  const k = new Float64Array(6);
  const c = new Float64Array(6);
  const K = new Float64Array(36);
  const C = new Float64Array(36);
  evaluateImpedanceMatrix(impedance, omega1, K, C, k, c, false);
  // Undamped modes with the real stiffness at the first rotor's rated speed.
  // Springs on a base block: the twelve modes, the base's soil stiffness at the same frequency.
  const modes = impedance.twoStage ? twoStageModes(model.massMatrix, impedance.twoStage, omega1) : naturalModes(model.massMatrix, impedance.evaluateMatrix ? K : k);
  const solver = new HarmonicSolver(model.massMatrix, impedance, soil.materialDamping);
  const modesHz = modes.map((m) => m.frequencyHz);
  const rotors = rotorResults(model, solver, modesHz);
  const combined = combinedResults(model, solver, modesHz);
  const ratio = Array.from(k, (ki, i) => ratioFromDashpot(c[i] as number, ki, model.massDiagonal[i] as number));
  const impedanceResult: ImpedanceResult = {
    method: impedance.method,
    staticStiffness: dofFromArray(impedance.staticStiffness),
    stiffness: dofFromArray(k),
    dampingRatio: dofFromArray(ratio),
    dashpot: dofFromArray(c),
    evaluatedAtHz: omega1 / (2 * Math.PI),
    materialDamping: soil.materialDamping,
    ...(springMethod ? {} : { shearModulus: soil.shearModulus, shearWaveVelocity: soil.shearWaveVelocity }),
    details: impedance.details,
  };
  if (impedance.evaluateMatrix) {
    impedanceResult.coupling = offDiagonalTerms(K, C).map((t) => ({
      dofs: [DOF_KEYS[t.i] as (typeof DOF_KEYS)[number], DOF_KEYS[t.j] as (typeof DOF_KEYS)[number]],
      stiffness: t.stiffness,
      dashpot: t.dashpot,
    }));
  }
  return { factor, soil, impedance, impedanceResult, stiffnessUsed: k, dashpotUsed: c, stiffnessMatrix: K, dashpotMatrix: C, modes, rotors, combined, solver };
}
