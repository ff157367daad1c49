// Start-up and coast-down of a rotor through the block's resonances by time integration
// (Newmark's average-acceleration method, transient-newmark.ts), on the same six-DOF model as
// the harmonic analysis: mass matrix about O, diagonal springs and dashpots at O, the rotor's
// unbalance shared over its bearings, the contract's load cases and static or couple unbalance.
//
// Speed w(t) = w0 + alpha t (constant angular acceleration), phase phi(t) = w0 t + alpha t^2 / 2.
// The force of an eccentric mass m e turning at phi(t) has the centripetal part m e phi'^2 along
// the eccentricity and the tangential part m e phi'' against the turning direction (kinematics of
// a point of a rigid body turning about a fixed axis); in the phasor notation of unbalance.ts
// (u(t) = Re(U e^{i phi})) the force is Re(P (m e w^2 - i m e alpha) e^{i phi}), P the unit load.
// m e = F_rated / w_rated^2 (service factor included), which is m_rotor G / w_rated for a balance
// grade (ISO 1940-1) and the vendor force's scaling (w / w_rated)^2 otherwise.
//
// The time domain needs frequency-independent springs and dashpots: K and C are those the engine
// uses at the rotor's rated speed, and the material (hysteretic) damping beta, K (1 + 2 i beta), is
// replaced by the viscous dashpot 2 beta K / w_ref with w_ref the rated speed: the usual
// equivalence of equal energy dissipated per cycle at w_ref (Chopra, Dynamics of Structures,
// equivalent viscous damping; recalled from memory). At a natural frequency w_n below w_ref this
// gives the damping ratio beta w_n / w_ref < beta (conservative); above w_ref it overstates it
// (warned).
import { ComplexSystem6 } from "./complex-lu";
import { dofFromArray } from "./dof";
import { naturalModes } from "./eigen";
import { assertFinite } from "./finite";
import { forceAt, responseSet, type HarmonicSolver, type ResponseSet } from "./harmonic";
import { checkTransientRequest } from "./input-consistency";
import { buildModel, type Model, type RotorModel } from "./model";
import { evaluateImpedanceMatrix } from "./impedance-model";
import { formatPath, type InputIssue } from "./parse";
import type { TransientPeak, TransientResult, UnbalanceModeName } from "./result-types";
import { transientRequestSchema, type AnalysisInput, type TransientRequest, type TransientRequestDocument } from "./schema";
import { runSoilCase, type SoilCase } from "./soil-case";
import { linspace } from "./sweep-grid";
import { NewmarkAverageAcceleration } from "./transient-newmark";
import { solveComplexDense, twoStageModes, twoStageTimeDomain, type TwoStageParts } from "./two-stage";
import { resolveTransientSpeeds, TRANSIENT_LIMITS } from "./transient-settings";
import { rpmToRadPerSec } from "./unbalance";
import { goldenSectionMaximum } from "./golden-section";

/** An invalid stand-alone request (analyseTransient); `issues` have paths relative to the request. */
export class TransientRequestError extends Error {
  constructor(readonly issues: InputIssue[]) {
    super(`invalid transient request: ${issues.map((i) => `${i.path}: ${i.message}`).join("; ")}`);
    this.name = "TransientRequestError";
  }
}

/** What one integration needs, resolved from a request. */
export interface TransientRunSpec {
  rotor: RotorModel;
  /** Index into rotor.loads (case and unbalance mode). */
  loadIndex: number;
  fromRpm: number;
  toRpm: number;
  durationS: number;
  outputPoints: number;
  /**
   * Initial state: "steady" (default) the steady state of the time-domain model running at
   * fromRpm before the speed starts to change (rest when fromRpm is 0); "rest" u = v = 0.
   */
  start?: "steady" | "rest";
  /** Steps per shortest period (default TRANSIENT_LIMITS.stepsPerPeriod); tests use finer steps. */
  stepsPerPeriod?: number;
  /** Step budget of the run (default TRANSIENT_LIMITS.maxSteps); beyond it the step is coarsened. */
  maxSteps?: number;
}

/** The raw outcome of one integration (before the frequency-domain comparison). */
export interface TransientIntegration {
  timeStepS: number;
  steps: number;
  stepsPerShortestPeriod: number;
  referenceOmega: number;
  stiffness: Float64Array;
  dashpot: Float64Array;
  naturalFrequenciesHz: number[];
  timeS: number[];
  speedRpm: number[];
  displacementPeak: number[][];
  velocityPeak: number[][];
  /** Overall peaks: value, step index and bearing index. */
  dPeak: { value: number; step: number; point: number };
  vPeak: { value: number; step: number; point: number };
  coarsened: boolean;
}

/**
 * Frozen springs and dashpots of the time-domain model (see the header): the diagonal k, c and
 * the full row-major 6 x 6 K, C (off-diagonal zeros for a diagonal support).
 */
export function timeDomainSprings(soilCase: SoilCase, omegaRef: number): { k: Float64Array; c: Float64Array; K: Float64Array; C: Float64Array } {
  const k = new Float64Array(6);
  const c = new Float64Array(6);
  const K = new Float64Array(36);
  const C = new Float64Array(36);
  evaluateImpedanceMatrix(soilCase.impedance, omegaRef, K, C, k, c, false);
  const beta = soilCase.soil.materialDamping;
  for (let i = 0; i < 36; i++) C[i] = (C[i] as number) + (2 * beta * (K[i] as number)) / omegaRef;
  for (let i = 0; i < 6; i++) c[i] = C[i * 7] as number;
  return { k, c, K, C };
}

/** Springs on a base block: the springs' own constant k, c (diagonal and full) for the run's report. */
function springsOwnTimeDomain(parts: TwoStageParts): { k: Float64Array; c: Float64Array; K: Float64Array; C: Float64Array } {
  const k = new Float64Array(6);
  const c = new Float64Array(6);
  for (let i = 0; i < 6; i++) {
    k[i] = parts.springK[i * 7] as number;
    c[i] = parts.springC[i * 7] as number;
  }
  return { k, c, K: Float64Array.from(parts.springK), C: Float64Array.from(parts.springC) };
}

/**
 * Generalised force at O, into `out`, of the unbalance m e turning at phase phi with speed omega
 * and angular acceleration alpha: Re(P (m e omega^2 - i m e alpha) e^{i phi}), P = re + i im the
 * unit load of unbalance.ts (see the header for the tangential term).
 */
export function unbalanceForceAt(
  me: number,
  re: Float64Array,
  im: Float64Array,
  omega: number,
  alpha: number,
  phi: number,
  out: Float64Array,
): void {
  const A = me * omega * omega;
  const B = me * alpha;
  const cp = Math.cos(phi);
  const sp = Math.sin(phi);
  for (let j = 0; j < 6; j++) {
    const r = re[j] as number;
    const i = im[j] as number;
    // Re((r + i i)(A - i B)(cos phi + i sin phi))
    out[j] = (A * r + B * i) * cp - (A * i - B * r) * sp;
  }
}

/** Integrates one run through time; allocation-free inside the step loop. */
export function integrateRun(model: Model, soilCase: SoilCase, spec: TransientRunSpec): TransientIntegration {
  const { rotor } = spec;
  const load = rotor.loads[spec.loadIndex];
  if (!load) throw new Error("internal error: no such load");
  const omegaRef = rotor.omegaRated;
  const parts = soilCase.impedance.twoStage;
  // springs on a base block: twelve DOFs (two-stage.ts), the springs' own k, c reported
  const twelve = parts ? twoStageTimeDomain(model.massMatrix, parts, omegaRef) : null;
  const { k, c, K, C } = parts ? springsOwnTimeDomain(parts) : timeDomainSprings(soilCase, omegaRef);
  const coupled = soilCase.impedance.evaluateMatrix !== undefined;
  const naturalFrequenciesHz = parts ? twoStageModes(model.massMatrix, parts, omegaRef).map((m) => m.frequencyHz) : naturalModes(model.massMatrix, coupled ? K : k).map((m) => m.frequencyHz);

  // Time step from the highest frequency of the run, natural or excitation.
  const fHigh = Math.max(Math.max(...naturalFrequenciesHz), Math.max(spec.fromRpm, spec.toRpm) / 60);
  const perPeriod = spec.stepsPerPeriod ?? TRANSIENT_LIMITS.stepsPerPeriod;
  let steps = Math.max(Math.ceil(spec.durationS * fHigh * perPeriod), spec.outputPoints);
  const maxSteps = Math.max(spec.maxSteps ?? TRANSIENT_LIMITS.maxSteps, spec.outputPoints);
  const coarsened = steps > maxSteps;
  if (coarsened) steps = maxSteps;
  const dt = spec.durationS / steps;

  const w0 = rpmToRadPerSec(spec.fromRpm);
  const alpha = (rpmToRadPerSec(spec.toRpm) - w0) / spec.durationS;
  // m e with the service factor: F_rated = m e w_rated^2
  const me = rotor.forceAtRated / (omegaRef * omegaRef);
  const re = load.re;
  const im = load.im;

  const integrator = twelve
    ? new NewmarkAverageAcceleration(twelve.M, twelve.K, twelve.C, dt)
    : coupled
      ? new NewmarkAverageAcceleration(model.massMatrix, K, C, dt)
      : new NewmarkAverageAcceleration(model.massMatrix, k, c, dt);
  const dofs = twelve ? 12 : 6;
  const u0 = new Float64Array(dofs);
  const v0 = new Float64Array(dofs);
  if (twelve && spec.start !== "rest" && w0 > 0) {
    // steady state at constant w0 of the twelve-DOF model: (K - w0^2 M + i w0 C) U = m e w0^2 P
    const n = 12;
    const Ar = new Float64Array(n * n);
    const Ai = new Float64Array(n * n);
    for (let i = 0; i < n * n; i++) {
      Ar[i] = (twelve.K[i] as number) - w0 * w0 * (twelve.M[i] as number);
      Ai[i] = w0 * (twelve.C[i] as number);
    }
    const br = new Float64Array(n);
    const bi = new Float64Array(n);
    for (let j = 0; j < 6; j++) {
      br[j] = re[j] as number;
      bi[j] = load.realOnly ? 0 : (im[j] as number);
    }
    const x = solveComplexDense(n, Ar, Ai, br, bi);
    const f0 = me * w0 * w0;
    for (let j = 0; j < n; j++) {
      u0[j] = f0 * (x.re[j] as number);
      v0[j] = -w0 * f0 * (x.im[j] as number);
    }
  } else if (spec.start !== "rest" && w0 > 0) {
    // steady state at constant w0 of (K - w0^2 M + i w0 C) U = m e w0^2 P; u = Re U, v = Re(i w0 U)
    const system = new ComplexSystem6();
    system.assemble(w0, model.massMatrix, K, C, 0);
    system.factorise();
    const xr = new Float64Array(6);
    const xi = new Float64Array(6);
    system.solveMany([re], [load.realOnly ? null : im], Int32Array.of(0), xr, xi);
    const f0 = me * w0 * w0;
    for (let j = 0; j < 6; j++) {
      u0[j] = f0 * (xr[j] as number);
      v0[j] = -w0 * f0 * (xi[j] as number);
    }
  }
  // the unbalance acts on the upper block only (the base's six entries stay 0)
  const f = new Float64Array(dofs);
  unbalanceForceAt(me, re, im, w0, alpha, 0, f);
  integrator.start(u0, v0, f);

  const nb = rotor.input.bearings.length;
  const pc = rotor.pointCoords;
  const bins = Math.min(spec.outputPoints, steps);
  const dBin = new Float64Array(nb * bins);
  const vBin = new Float64Array(nb * bins);
  const dPeak = { value: -1, step: 0, point: 0 };
  const vPeak = { value: -1, step: 0, point: 0 };
  const u = integrator.u;
  const v = integrator.v;
  let bin = 0;
  let binEnd = Math.floor(steps / bins);

  // Largest displacement and velocity components at each bearing, u_p = u_t + theta x p.
  const record = (n: number): void => {
    while (n > binEnd) {
      bin++;
      binEnd = Math.floor(((bin + 1) * steps) / bins);
    }
    for (let p = 0; p < nb; p++) {
      const px = pc[3 * p] as number;
      const py = pc[3 * p + 1] as number;
      const pz = pc[3 * p + 2] as number;
      const ux = Math.abs((u[0] as number) + (u[4] as number) * pz - (u[5] as number) * py);
      const uy = Math.abs((u[1] as number) + (u[5] as number) * px - (u[3] as number) * pz);
      const uz = Math.abs((u[2] as number) + (u[3] as number) * py - (u[4] as number) * px);
      const vx = Math.abs((v[0] as number) + (v[4] as number) * pz - (v[5] as number) * py);
      const vy = Math.abs((v[1] as number) + (v[5] as number) * px - (v[3] as number) * pz);
      const vz = Math.abs((v[2] as number) + (v[3] as number) * py - (v[4] as number) * px);
      const d = ux > uy ? (ux > uz ? ux : uz) : uy > uz ? uy : uz;
      const s = vx > vy ? (vx > vz ? vx : vz) : vy > vz ? vy : vz;
      const at = p * bins + bin;
      if (d > (dBin[at] as number)) dBin[at] = d;
      if (s > (vBin[at] as number)) vBin[at] = s;
      if (d > dPeak.value) {
        dPeak.value = d;
        dPeak.step = n;
        dPeak.point = p;
      }
      if (s > vPeak.value) {
        vPeak.value = s;
        vPeak.step = n;
        vPeak.point = p;
      }
    }
  };

  record(0);
  for (let n = 1; n <= steps; n++) {
    const t = n * dt;
    unbalanceForceAt(me, re, im, w0 + alpha * t, alpha, w0 * t + 0.5 * alpha * t * t, f);
    integrator.step(f);
    record(n);
  }

  const rpmAt = (t: number) => spec.fromRpm + ((spec.toRpm - spec.fromRpm) * t) / spec.durationS;
  const timeS: number[] = [];
  const speedRpm: number[] = [];
  for (let b = 0; b < bins; b++) {
    const t = ((Math.floor((b * steps) / bins) + Math.floor(((b + 1) * steps) / bins)) * dt) / 2;
    timeS.push(t);
    speedRpm.push(rpmAt(t));
  }
  return {
    timeStepS: dt,
    steps,
    stepsPerShortestPeriod: 1 / (fHigh * dt),
    referenceOmega: omegaRef,
    stiffness: k,
    dashpot: c,
    naturalFrequenciesHz,
    timeS,
    speedRpm,
    displacementPeak: Array.from({ length: nb }, (_, p) => Array.from(dBin.subarray(p * bins, (p + 1) * bins))),
    velocityPeak: Array.from({ length: nb }, (_, p) => Array.from(vBin.subarray(p * bins, (p + 1) * bins))),
    dPeak,
    vPeak,
    coarsened,
  };
}

/** Largest displacement component at each bearing of the full harmonic analysis at `rpm`, into `out`. */
function harmonicBearings(
  solver: HarmonicSolver,
  rotor: RotorModel,
  loadIndex: number,
  rpm: number,
  u: ResponseSet,
  out: Float64Array,
): void {
  const omega = rpmToRadPerSec(rpm);
  if (!(omega > 0)) {
    out.fill(0);
    return;
  }
  solver.setFrequency(omega);
  solver.solveAll(rotor.loads, u);
  const coords = rotor.pointCoords.subarray(0, 3 * rotor.input.bearings.length);
  solver.pointAmplitudes(u, loadIndex, coords, forceAt(rotor.forceAtRated, rotor.omegaRated, omega), out, false);
}

const REFINE_ITERATIONS = 40;

/**
 * The largest value of g over [lo, hi]: an even grid of 201 speeds plus the natural frequencies
 * inside, then a golden-section search between the neighbours of the best grid speed.
 */
function maximiseOverSpeeds(g: (rpm: number) => number, lo: number, hi: number, extraRpm: number[]): { value: number; atRpm: number } {
  const grid = [...new Set([...linspace(lo, hi, 201), ...extraRpm.filter((r) => r > lo && r < hi)])].sort((a, b) => a - b);
  const values = grid.map(g);
  let best = 0;
  for (let i = 1; i < grid.length; i++) if ((values[i] as number) > (values[best] as number)) best = i;
  const a = grid[Math.max(best - 1, 0)] as number;
  const b = grid[Math.min(best + 1, grid.length - 1)] as number;
  let value = values[best] as number;
  let atRpm = grid[best] as number;
  const { x1, f1: g1, x2, f2: g2 } = goldenSectionMaximum(g, a, b, { iterations: REFINE_ITERATIONS });
  for (const [x, gx] of [
    [x1, g1],
    [x2, g2],
  ] as const) {
    if (gx > value) {
      value = gx;
      atRpm = x;
    }
  }
  return { value, atRpm };
}

function unbalanceModeOf(request: TransientRequest, rotor: RotorModel): UnbalanceModeName {
  return request.unbalanceMode ?? (rotor.input.unbalanceMode === "couple" ? "couple" : "static");
}

/**
 * One run of a (consistent) request on a built model and its nominal soil case; `maxSteps` is
 * the run's step budget.
 */
export function transientRun(model: Model, soilCase: SoilCase, request: TransientRequest, maxSteps: number = TRANSIENT_LIMITS.maxSteps): TransientResult {
  const rotor = model.rotors.find((r) => r.machine === request.machine && r.rotor === request.rotor);
  if (!rotor) throw new Error(`internal error: no rotor "${request.rotor}" on machine "${request.machine}"`);
  const unbalanceMode = unbalanceModeOf(request, rotor);
  const loadIndex = rotor.loads.findIndex((l) => l.case === request.case && l.unbalanceMode === unbalanceMode);
  if (loadIndex < 0) throw new Error("internal error: no load for the run's case and unbalance mode");
  const { fromRpm, toRpm } = resolveTransientSpeeds(request, rotor.speedRpm);
  const run = integrateRun(model, soilCase, {
    rotor,
    loadIndex,
    fromRpm,
    toRpm,
    durationS: request.durationS,
    outputPoints: request.outputPoints,
    maxSteps,
  });

  const label = `Transient ${request.kind} of ${rotor.machine} ${rotor.rotor} (${request.case}, ${unbalanceMode})`;
  const warnings: string[] = [];
  const refHz = run.referenceOmega / (2 * Math.PI);
  if (soilCase.impedance.frequencyDependent) {
    warnings.push(`${label}: the frequency-dependent springs and dashpots are frozen at the rated speed (${refHz.toFixed(2)} Hz) for the time integration.`);
  }
  const lo = Math.min(fromRpm, toRpm);
  const hi = Math.max(fromRpm, toRpm);
  // springs on a base block: the soil's material damping is the base's (steel springs have none)
  const beta = soilCase.impedance.twoStage?.beta ?? soilCase.soil.materialDamping;
  const above = run.naturalFrequenciesHz.filter((fn) => fn * 60 > lo && fn * 60 < hi && fn > refHz);
  if (beta > 0 && above.length > 0) {
    warnings.push(
      `${label}: material damping is made viscous at the rated speed (${refHz.toFixed(2)} Hz); at the natural frequencies ${above.map((fn) => fn.toFixed(2)).join(", ")} Hz above it, inside the run, it is overstated by the ratio of frequencies.`,
    );
  }
  if (run.coarsened) {
    const W = (2 * Math.PI) / run.stepsPerShortestPeriod;
    const elongation = W / (2 * Math.atan(W / 2)) - 1;
    warnings.push(
      `${label}: the run needs more than its budget of ${run.steps} time steps; integrated with ${run.stepsPerShortestPeriod.toFixed(1)} steps per shortest period instead of ${TRANSIENT_LIMITS.stepsPerPeriod} (period elongation ${(100 * elongation).toFixed(2)} %)${run.stepsPerShortestPeriod < TRANSIENT_LIMITS.minStepsPerPeriod ? "; the peaks are unreliable, shorten the run" : ""}.`,
    );
  }

  // Comparison with the frequency-domain analysis (frequency-dependent K, hysteretic damping).
  const nb = rotor.input.bearings.length;
  const amp = new Float64Array(nb);
  const u = responseSet(rotor.loads.length);
  const solver = soilCase.solver;
  const maxAt = (rpm: number): number => {
    harmonicBearings(solver, rotor, loadIndex, rpm, u, amp);
    let m = 0;
    for (let i = 0; i < nb; i++) m = Math.max(m, amp[i] as number);
    return m;
  };
  const atPoint = (rpm: number, point: number): number => {
    harmonicBearings(solver, rotor, loadIndex, rpm, u, amp);
    return amp[point] as number;
  };
  const rpmAtStep = (n: number) => fromRpm + ((toRpm - fromRpm) * n * run.timeStepS) / request.durationS;
  const peak = (p: { value: number; step: number; point: number }, velocity: boolean): TransientPeak => {
    const atRpm = rpmAtStep(p.step);
    const d = atPoint(atRpm, p.point);
    return {
      value: p.value,
      atTimeS: p.step * run.timeStepS,
      atRpm,
      point: rotor.points[p.point]?.name ?? "",
      steadyStateAtSameSpeed: velocity ? d * rpmToRadPerSec(atRpm) : d,
    };
  };
  const modesRpm = [...soilCase.modes.map((m) => m.frequencyHz * 60), ...run.naturalFrequenciesHz.map((fn) => fn * 60)];
  const dMax = maximiseOverSpeeds(maxAt, lo, hi, modesRpm);
  const vMax = maximiseOverSpeeds((rpm) => maxAt(rpm) * rpmToRadPerSec(rpm), lo, hi, modesRpm);

  return {
    machine: rotor.machine,
    rotor: rotor.rotor,
    kind: request.kind,
    case: request.case,
    unbalanceMode,
    fromRpm,
    toRpm,
    durationS: request.durationS,
    angularAcceleration: (rpmToRadPerSec(toRpm) - rpmToRadPerSec(fromRpm)) / request.durationS,
    timeStepS: run.timeStepS,
    steps: run.steps,
    stepsPerShortestPeriod: run.stepsPerShortestPeriod,
    model: {
      referenceHz: refHz,
      stiffness: dofFromArray(run.stiffness),
      dashpot: dofFromArray(run.dashpot),
      naturalFrequenciesHz: run.naturalFrequenciesHz,
    },
    points: rotor.points.slice(0, nb).map((p) => ({ name: p.name, position: p.position })),
    series: {
      timeS: run.timeS,
      speedRpm: run.speedRpm,
      displacementPeak: run.displacementPeak,
      velocityPeak: run.velocityPeak,
    },
    peakDisplacement: peak(run.dPeak, false),
    peakVelocity: peak(run.vPeak, true),
    steadyStateMax: { displacementPeak: dMax.value, atRpm: dMax.atRpm, velocityPeak: vMax.value, velocityAtRpm: vMax.atRpm },
    warnings,
  };
}

/**
 * Every run of input.transient (the input is valid, so every request is consistent), the total
 * step budget shared equally between the runs.
 */
export function transientResults(model: Model, soilCase: SoilCase, requests: TransientRequest[]): TransientResult[] {
  const budget = Math.min(TRANSIENT_LIMITS.maxSteps, Math.floor(TRANSIENT_LIMITS.maxTotalSteps / Math.max(requests.length, 1)));
  return requests.map((request) => transientRun(model, soilCase, request, budget));
}

/**
 * One start-up or coast-down run on its own, for a valid input (see parseAnalysisInput) and a
 * request as written (defaults applied here). Throws TransientRequestError when the request is
 * invalid, with paths relative to the request (e.g. "rotor").
 */
export function analyseTransient(input: AnalysisInput, request: TransientRequestDocument): TransientResult {
  const parsed = transientRequestSchema.safeParse(request);
  if (!parsed.success) {
    throw new TransientRequestError(
      parsed.error.issues.flatMap((issue) =>
        issue.code === "unrecognized_keys"
          ? issue.keys.map((key) => ({ path: formatPath([...issue.path, key]), message: "unknown field" }))
          : [{ path: formatPath(issue.path), message: issue.message }],
      ),
    );
  }
  const issues: InputIssue[] = [];
  checkTransientRequest(input, parsed.data, [], (path, message) => issues.push({ path: formatPath(path), message }));

  if (issues.length > 0) throw new TransientRequestError(issues);
  const model = buildModel(input);
  const result = transientRun(model, runSoilCase(model, 1), parsed.data);
  assertFinite(result);
  return result;
}
