// Size and magnitude limits of the analysis input (contract v1), and a check of them that works
// on any document, complete or not (a draft may be saved unfinished). The schema applies the
// same limits, so a document refused here is refused by the parser at the same path.
//
// The limits keep the worst accepted input to a few seconds of one core and a bounded result:
// the sweep writes one series per (rotor, load case, unbalance mode, response point) and per
// frequency, so its output grows as the product of those lists; measured figures are in
// CONVENTIONS.md ("Input limits") and `npm run bench`.
import { TRANSIENT_LIMITS } from "./transient-settings";
import { SWEEP_DEFAULTS } from "./criteria-defaults";

export const INPUT_LIMITS = {
  /** block.solids: a stepped block with pedestals, plinths and pits rarely needs twenty. */
  maxSolids: 50,
  /** machines: a train of driver, gearbox and driven machines with auxiliaries. */
  maxMachines: 8,
  /** machines[i].rotors */
  maxRotorsPerMachine: 4,
  /** all rotors of all machines together */
  maxRotors: 8,
  /** machines[i].rotors[j].bearings */
  maxBearingsPerRotor: 6,
  /** impedance.springs (method "springs"): an inertia block rarely sits on more than a few dozen isolators. */
  maxSprings: 64,
  /** impedance.piles (method "piles"): the interaction matrix is dense (2 n x 2 n complex, solved per frequency). */
  maxPiles: 40,
  /** checkPoints */
  maxCheckPoints: 24,
  /** sweep.points: a plotting grid of 600 to 2000 points is usual. */
  maxSweepPoints: 2000,
  /**
   * sweep.points times the number of response series (every rotor's load cases times its
   * bearings plus the check points): bounds the size of the result (about 75 bytes of JSON per
   * value at the limits, the rest of the result included). The demo train at 2000 points uses 48,000.
   */
  maxSweepValues: 240_000,
  /** transient: start-up and coast-down runs. */
  maxTransientRuns: TRANSIENT_LIMITS.maxRuns,
  /** transient[i].outputPoints */
  maxTransientOutputPoints: TRANSIENT_LIMITS.maxOutputPoints,
  /** Time steps of all runs together: not a field; the engine coarsens the step past it, with a warning. */
  maxTransientTotalSteps: TRANSIENT_LIMITS.maxTotalSteps,
  /** Characters of any text (names, references to names). */
  maxTextLength: 100,
  /** Characters of a band-check acceptance's written justification (a paragraph, with its references). */
  maxJustificationLength: 2000,
  /**
   * Largest magnitude of any number, in SI units. Far above every real quantity of the contract
   * (a rocking stiffness of a 30 m mat on hard rock is about 1e15 N m/rad) and far below the
   * range where the engine's products overflow (1e308 is refused).
   */
  maxAbsNumber: 1e16,
} as const;

export type PathPart = string | number;

export interface BoundIssue {
  path: PathPart[];
  message: string;
}

/** Response series of one rotor: three load cases per unbalance mode, each at every bearing and check point. */
export function seriesOfRotor(unbalanceMode: unknown, bearings: number, checkPoints: number): number {
  return 3 * (unbalanceMode === "both" ? 2 : 1) * (bearings + checkPoints);
}

export function sweepValuesMessage(series: number): string {
  const most = Math.max(2, Math.floor(INPUT_LIMITS.maxSweepValues / Math.max(1, series)));
  return `with ${series} response series (rotors x load cases x (bearings + check points)) the sweep may have at most ${most} points (sweep.points x series at most ${INPUT_LIMITS.maxSweepValues}); lower sweep.points or remove check points`;
}

const isObject = (v: unknown): v is Record<string, unknown> => v !== null && typeof v === "object" && !Array.isArray(v);

/**
 * Every limit of INPUT_LIMITS on a document that may be incomplete or malformed: list lengths
 * and numbers wherever they are present, nothing required. Walks without recursion, so any
 * nesting depth is safe.
 */
export function checkInputBounds(raw: unknown): BoundIssue[] {
  const issues: BoundIssue[] = [];
  const L = INPUT_LIMITS;
  const add = (path: PathPart[], message: string) => issues.push({ path, message });

  // every number and text anywhere; a node keeps its parent, so the path is built only for an issue
  interface Node {
    value: unknown;
    key: PathPart | null;
    parent: Node | null;
  }
  const pathOf = (node: Node): PathPart[] => {
    const path: PathPart[] = [];
    for (let n: Node | null = node; n && n.key !== null; n = n.parent) path.push(n.key);
    return path.reverse();
  };
  const stack: Node[] = [{ value: raw, key: null, parent: null }];
  while (stack.length) {
    const node = stack.pop() as Node;
    const value = node.value;
    if (typeof value === "number") {
      if (!Number.isFinite(value)) add(pathOf(node), "must be a finite number");
      else if (Math.abs(value) > L.maxAbsNumber) add(pathOf(node), `must lie within ±${L.maxAbsNumber.toExponential().replace("+", "")} (SI units)`);
    } else if (typeof value === "string") {
      const max = node.key === "justification" ? L.maxJustificationLength : L.maxTextLength;
      if (value.length > max) add(pathOf(node), `must be at most ${max} characters`);
    } else if (Array.isArray(value)) {
      for (let i = value.length - 1; i >= 0; i--) stack.push({ value: value[i], key: i, parent: node });
    } else if (isObject(value)) {
      for (const key of Object.keys(value).reverse()) stack.push({ value: value[key], key, parent: node });
    }
  }
  if (!isObject(raw)) return issues;

  const maxLength = (value: unknown, path: PathPart[], max: number, what: string) => {
    if (Array.isArray(value) && value.length > max) add(path, `at most ${max} ${what} (${value.length} given)`);
  };
  const block = raw.block;
  if (isObject(block)) maxLength(block.solids, ["block", "solids"], L.maxSolids, "solids");
  maxLength(raw.checkPoints, ["checkPoints"], L.maxCheckPoints, "check points");
  if (isObject(raw.impedance)) maxLength(raw.impedance.springs, ["impedance", "springs"], L.maxSprings, "springs");
  if (isObject(raw.impedance)) maxLength(raw.impedance.piles, ["impedance", "piles"], L.maxPiles, "piles");
  maxLength(raw.transient, ["transient"], L.maxTransientRuns, "runs");
  maxLength(raw.machines, ["machines"], L.maxMachines, "machines");

  const checkPoints = Array.isArray(raw.checkPoints) ? raw.checkPoints.length : 0;
  let rotorCount = 0;
  let series = 0;
  if (Array.isArray(raw.machines)) {
    raw.machines.forEach((machine, mi) => {
      if (!isObject(machine) || !Array.isArray(machine.rotors)) return;
      maxLength(machine.rotors, ["machines", mi, "rotors"], L.maxRotorsPerMachine, "rotors per machine");
      rotorCount += machine.rotors.length;
      machine.rotors.forEach((rotor, ri) => {
        if (!isObject(rotor)) return;
        maxLength(rotor.bearings, ["machines", mi, "rotors", ri, "bearings"], L.maxBearingsPerRotor, "bearings per rotor");
        series += seriesOfRotor(rotor.unbalanceMode, Array.isArray(rotor.bearings) ? rotor.bearings.length : 0, checkPoints);
      });
    });
    if (rotorCount > L.maxRotors) add(["machines"], `at most ${L.maxRotors} rotors in all machines together (${rotorCount} given)`);
  }

  const sweep = raw.sweep;
  const points = isObject(sweep) ? sweep.points : undefined;
  if (typeof points === "number" && Number.isFinite(points) && points > L.maxSweepPoints) {
    add(["sweep", "points"], `must be at most ${L.maxSweepPoints}`);
  } else {
    const n = typeof points === "number" && Number.isFinite(points) ? points : SWEEP_DEFAULTS.points;
    if (n * series > L.maxSweepValues) add(["sweep", "points"], sweepValuesMessage(series));
  }

  if (Array.isArray(raw.transient)) {
    raw.transient.forEach((run, i) => {
      const out = isObject(run) ? run.outputPoints : undefined;
      if (typeof out === "number" && out > L.maxTransientOutputPoints) add(["transient", i, "outputPoints"], `must be at most ${L.maxTransientOutputPoints}`);
    });
  }
  return issues;
}
