// Response of each rotor on its own (no superposition of rotors): the steady state at its
// rated speed, and the envelope over its operating speed range.
import { forceAt, responseSet, type HarmonicSolver, type ResponseSet } from "./harmonic";
import type { Model, RotorModel } from "./model";
import type { CaseResult, GoverningAmplitudes, PointResult, RotorResult } from "./result-types";
import { speedGridRpm } from "./sweep-grid";
import { rpmToRadPerSec } from "./unbalance";
import type { Vec3 } from "./vec3";

function ratedCases(rotor: RotorModel, solver: HarmonicSolver, u: ResponseSet): CaseResult[] {
  const omega = rotor.omegaRated;
  solver.setFrequency(omega);
  solver.solveAll(rotor.loads, u);
  const n = rotor.points.length;
  const amp = new Float64Array(3 * n);
  const trans = new Float64Array(3);
  return rotor.loads.map((load, l) => {
    solver.pointAmplitudes(u, l, rotor.pointCoords, rotor.forceAtRated, amp, true);
    const norm = solver.transmittedForce(u, l, rotor.forceAtRated, trans);
    const points: PointResult[] = rotor.points.map((p, i) => {
      const d: Vec3 = [amp[3 * i] as number, amp[3 * i + 1] as number, amp[3 * i + 2] as number];
      return { name: p.name, position: p.position, displacementPeak: d, velocityPeak: [d[0] * omega, d[1] * omega, d[2] * omega] };
    });
    return {
      case: load.case,
      unbalanceMode: load.unbalanceMode,
      points,
      transmittedForce: [trans[0] as number, trans[1] as number, trans[2] as number],
      // |transmitted force| (vector norm of the per-axis amplitudes) over the force amplitude
      transmissibility: norm / rotor.forceAtRated,
      maxOverSpeedRange: { displacementPeak: 0, atRpm: rotor.speedRpm },
    };
  });
}

interface Envelope {
  /** Per load and point: largest displacement and velocity component. */
  dMax: Float64Array;
  vMax: Float64Array;
  /** Per load: overall maxima, where and at which speed. */
  d: Float64Array;
  dRpm: Float64Array;
  dPoint: Int32Array;
  v: Float64Array;
  vRpm: Float64Array;
}

/**
 * Envelopes over every rotor's speed grid. Speeds shared by several rotors (equal ranges) are
 * factorised once for all of them.
 */
function envelopes(rotors: RotorModel[], solver: HarmonicSolver, modesHz: number[], u: ResponseSet): Envelope[] {
  const bySpeed = new Map<number, number[]>();
  rotors.forEach((rotor, r) => {
    for (const rpm of speedGridRpm(rotor.rangeRpm, rotor.speedRpm, modesHz)) {
      const list = bySpeed.get(rpm);
      if (list) list.push(r);
      else bySpeed.set(rpm, [r]);
    }
  });
  const env: Envelope[] = rotors.map((rotor) => {
    const nl = rotor.loads.length;
    return {
      dMax: new Float64Array(nl * rotor.points.length),
      vMax: new Float64Array(nl * rotor.points.length),
      d: new Float64Array(nl).fill(-1),
      dRpm: new Float64Array(nl),
      dPoint: new Int32Array(nl),
      v: new Float64Array(nl).fill(-1),
      vRpm: new Float64Array(nl),
    };
  });
  const maxPoints = Math.max(1, ...rotors.map((r) => r.points.length));
  const amp = new Float64Array(3 * maxPoints);
  for (const [rpm, list] of bySpeed) {
    const omega = rpmToRadPerSec(rpm);
    solver.setFrequency(omega);
    for (const r of list) {
      const rotor = rotors[r] as RotorModel;
      const e = env[r] as Envelope;
      const n = rotor.points.length;
      const f = forceAt(rotor.forceAtRated, rotor.omegaRated, omega);
      solver.solveAll(rotor.loads, u);
      for (let l = 0; l < rotor.loads.length; l++) {
        solver.pointAmplitudes(u, l, rotor.pointCoords, f, amp, false);
        for (let i = 0; i < n; i++) {
          const d = amp[i] as number;
          const v = d * omega;
          const at = l * n + i;
          if (d > (e.dMax[at] as number)) e.dMax[at] = d;
          if (v > (e.vMax[at] as number)) e.vMax[at] = v;
          if (d > (e.d[l] as number)) {
            e.d[l] = d;
            e.dRpm[l] = rpm;
            e.dPoint[l] = i;
          }
          if (v > (e.v[l] as number)) {
            e.v[l] = v;
            e.vRpm[l] = rpm;
          }
        }
      }
    }
  }
  return env;
}

export function rotorResults(model: Model, solver: HarmonicSolver, modesHz: number[]): RotorResult[] {
  const u = responseSet(Math.max(0, ...model.rotors.map((r) => r.loads.length)));
  const all = model.rotors.map((rotor) => ratedCases(rotor, solver, u));
  const env = envelopes(model.rotors, solver, modesHz, u);
  return model.rotors.map((rotor, r) => {
    const cases = all[r] as CaseResult[];
    const e = env[r] as Envelope;
    const n = rotor.points.length;
    cases.forEach((c, l) => {
      c.points.forEach((p, i) => {
        p.overSpeedRange = { displacementPeak: e.dMax[l * n + i] as number, velocityPeak: e.vMax[l * n + i] as number };
      });
      c.maxOverSpeedRange = {
        displacementPeak: e.d[l] as number,
        atRpm: e.dRpm[l] as number,
        point: rotor.points[e.dPoint[l] as number]?.name ?? "",
        velocityPeak: e.v[l] as number,
        velocityAtRpm: e.vRpm[l] as number,
      };
    });
    const speedHz = rotor.speedRpm / 60;
    return {
      machine: rotor.machine,
      rotor: rotor.rotor,
      speedRpm: rotor.speedRpm,
      speedRangeRpm: rotor.rangeRpm,
      forceAmplitude: rotor.forceAtRated,
      frequencyRatios: modesHz.map((f) => speedHz / f),
      cases,
    };
  });
}

/** Largest displacement and velocity component over all rotors, cases and points. */
export function governingAmplitudes(rotors: RotorResult[]): GoverningAmplitudes {
  const g: GoverningAmplitudes = { displacementPeak: 0, velocityPeak: 0, displacementPeakOverSpeedRange: 0, velocityPeakOverSpeedRange: 0 };
  for (const r of rotors) {
    for (const c of r.cases) {
      for (const p of c.points) {
        g.displacementPeak = Math.max(g.displacementPeak, ...p.displacementPeak);
        g.velocityPeak = Math.max(g.velocityPeak, ...p.velocityPeak);
        g.displacementPeakOverSpeedRange = Math.max(g.displacementPeakOverSpeedRange, p.overSpeedRange?.displacementPeak ?? 0);
        g.velocityPeakOverSpeedRange = Math.max(g.velocityPeakOverSpeedRange, p.overSpeedRange?.velocityPeak ?? 0);
      }
    }
  }
  return g;
}
