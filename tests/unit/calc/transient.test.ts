// Start-up and coast-down through resonance by Newmark time integration: the integrator against
// closed-form single-degree-of-freedom results, the six-DOF runs against the harmonic analysis
// and an independent Runge-Kutta integration, and the validation of the request.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import {
  analyse,
  analyseTransient,
  parseAnalysisInput,
  TransientRequestError,
  type AnalysisInput,
  type AnalysisInputDocument,
  type TransientResult,
} from "@/modules/calc";
import { buildModel } from "@/modules/calc/model";
import { runSoilCase } from "@/modules/calc/soil-case";
import { integrateRun, transientRun, unbalanceForceAt } from "@/modules/calc/transient";
import { NewmarkAverageAcceleration } from "@/modules/calc/transient-newmark";
import { rpmToRadPerSec } from "@/modules/calc/unbalance";
import { relClose, symmetricBlock } from "./helpers";

// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Json = any;

/** Runs a one-DOF Newmark integration under f(t) and returns the displacement history. */
function sdofHistory(m: number, k: number, c: number, dt: number, steps: number, u0: number, v0: number, force: (t: number) => number): Float64Array {
  const nm = new NewmarkAverageAcceleration([m], [k], [c], dt);
  nm.start([u0], [v0], [force(0)]);
  const f = new Float64Array(1);
  const u = new Float64Array(steps + 1);
  u[0] = u0;
  for (let n = 1; n <= steps; n++) {
    f[0] = force(n * dt);
    nm.step(f);
    u[n] = nm.u[0]!;
  }
  return u;
}

const maxAbs = (a: Float64Array, from: number) => {
  let m = 0;
  for (let i = from; i < a.length; i++) m = Math.max(m, Math.abs(a[i]!));
  return m;
};

describe("Newmark's average-acceleration method on one degree of freedom", () => {
  // Source: Chopra, Dynamics of Structures, sec. 3.2 (methods.md section 3):
  // A = (F0 / k) / sqrt((1 - r^2)^2 + (2 zeta r)^2) for F0 cos(w t).
  it.each([
    [0.05, 0.5],
    [0.05, 1],
    [0.05, 2],
    [0.2, 0.5],
    [0.2, 1],
    [0.2, 2],
  ])("damped, zeta %s, r %s: once the start has died out the amplitude is Chopra's steady state", (zeta, r) => {
    const m = 3;
    const wn = 2 * Math.PI * 1.5;
    const k = m * wn * wn;
    const c = 2 * zeta * Math.sqrt(k * m);
    const F0 = 2 * k; // static deflection 2
    const w = r * wn;
    const T = (2 * Math.PI) / Math.max(w, wn);
    const dt = T / 200;
    // e^{-zeta wn t} < 1e-7 before the last two forcing periods
    const tEnd = 16 / (zeta * wn) + (4 * Math.PI) / w;
    const steps = Math.ceil(tEnd / dt);
    const u = sdofHistory(m, k, c, dt, steps, 0, 0, (t) => F0 * Math.cos(w * t));
    const tail = steps - Math.ceil((4 * Math.PI) / w / dt);
    const expected = F0 / k / Math.hypot(1 - r * r, 2 * zeta * r);
    expect(relClose(maxAbs(u, tail), expected, 3e-3)).toBe(true);
  });

  it("undamped, r 0.5, started on the steady state: stays on Chopra's amplitude (F0 / k) / (1 - r^2)", () => {
    const m = 1;
    const k = (2 * Math.PI) ** 2;
    const r = 0.5;
    const w = r * 2 * Math.PI;
    const F0 = k;
    const A = F0 / k / (1 - r * r);
    const dt = (2 * Math.PI) / w / 400;
    const steps = 50 * 400;
    const u = sdofHistory(m, k, 0, dt, steps, A, 0, (t) => F0 * Math.cos(w * t));
    expect(relClose(maxAbs(u, steps - 800), A, 2e-3)).toBe(true);
    expect(relClose(maxAbs(u, 0), A, 2e-3)).toBe(true);
  });

  it("free vibration without damping: energy conserved at every step, period lengthened by W / (2 atan(W / 2))", () => {
    // Newmark (1959) and Chopra (sec. 5.5): the average-acceleration method has no amplitude decay,
    // only a period elongation (recalled from memory). The exact elongation follows from the
    // amplification matrix, eigenvalues (1 - W^2/4 +- i W) / (1 + W^2/4), argument 2 atan(W / 2)
    // (derived; the trapezoidal rule's known result, e.g. Hughes, The Finite Element Method, 1987,
    // recalled from memory).
    const m = 2;
    const k = 50;
    const w = Math.sqrt(k / m);
    const T = (2 * Math.PI) / w;
    const dt = T / 10;
    const W = w * dt;
    const nm = new NewmarkAverageAcceleration([m], [k], [0], dt);
    nm.start([0.01], [0], [0]);
    const E0 = 0.5 * k * 0.01 ** 2;
    const f = new Float64Array(1);
    let worst = 0;
    const crossings: number[] = [];
    let prev = 0.01;
    for (let n = 1; n <= 10000; n++) {
      nm.step(f);
      const u = nm.u[0]!;
      const v = nm.v[0]!;
      worst = Math.max(worst, Math.abs(0.5 * k * u * u + 0.5 * m * v * v - E0) / E0);
      // upward zero crossings, linearly interpolated
      if (prev < 0 && u >= 0) crossings.push((n - 1 + -prev / (u - prev)) * dt);
      prev = u;
    }
    expect(worst).toBeLessThan(1e-10);
    const periods = crossings.length - 1;
    expect(periods).toBeGreaterThan(900);
    const measured = (crossings[periods]! - crossings[0]!) / periods;
    const elongation = W / (2 * Math.atan(W / 2));
    expect(elongation).toBeGreaterThan(1.03); // 10 steps per period: about 3 %
    // (linear interpolation of the crossings limits the measurement to about 1e-5)
    expect(relClose(measured / T, elongation, 2e-5)).toBe(true);
    // and not merely the leading-order estimate 1 + W^2 / 12 (recalled from memory), 0.08 % off here
    expect(Math.abs(measured / T - (1 + (W * W) / 12))).toBeGreaterThan(5e-4);
  });
});

describe("unbalance force of an accelerating rotor", () => {
  it("equals minus the mass times the acceleration of the eccentric mass (Newton's second law, by central differences)", () => {
    // Shaft along x, rotating case: the unit load [0, 1, -i] turns the force as [0, cos phi, sin phi]
    // (contract), i.e. the eccentric mass sits at e [0, cos phi, sin phi].
    const re = Float64Array.of(0, 1, 0, 0, 0, 0);
    const im = Float64Array.of(0, 0, -1, 0, 0, 0);
    const me = 0.04;
    const w0 = 30;
    const alpha = -12; // a coast-down
    const phiAt = (t: number) => w0 * t + 0.5 * alpha * t * t;
    const out = new Float64Array(6);
    for (const t of [0.1, 0.37, 1.2]) {
      unbalanceForceAt(me, re, im, w0 + alpha * t, alpha, phiAt(t), out);
      const h = 1e-4;
      const pos = (s: number) => [Math.cos(phiAt(s)), Math.sin(phiAt(s))] as const;
      const [y0, z0] = pos(t);
      const [y1, z1] = pos(t + h);
      const [ym, zm] = pos(t - h);
      const ay = (y1 - 2 * y0 + ym) / (h * h);
      const az = (z1 - 2 * z0 + zm) / (h * h);
      // central differences are exact to O(h^2 w^2 / 12), about 1e-6 here; the tangential term is 1 % of the force
      expect(relClose(out[1]!, -me * ay, 1e-5, me * w0 * w0)).toBe(true);
      expect(relClose(out[2]!, -me * az, 1e-5, me * w0 * w0)).toBe(true);
      expect(Math.abs(out[0]!)).toBe(0);
    }
  });
});

// A symmetric block on user springs (no material damping), so the time-domain model and the
// harmonic analysis are the same model: vertical mode at 12 Hz with 5 % damping, decoupled.
const KZ = 5.2e8;
const userSprings = (zeta: number): AnalysisInputDocument["impedance"] => ({
  method: "user",
  stiffness: { x: 4e8, y: 4e8, z: KZ, rx: 6e9, ry: 8e9, rz: 6e9 },
  dampingRatio: { x: zeta, y: zeta, z: zeta, rx: zeta, ry: zeta, rz: zeta },
});

function parsed(doc: AnalysisInputDocument): AnalysisInput {
  const p = parseAnalysisInput(doc);
  if (!p.ok) throw new Error(JSON.stringify(p.issues));
  return p.input;
}

function runOf(doc: AnalysisInputDocument, request: Json): TransientResult {
  const result = analyse(parsed({ ...doc, transient: [request] }));
  expect(result.transient).toHaveLength(1);
  return result.transient![0]!;
}

describe("six-DOF runs against the harmonic analysis", () => {
  const doc = symmetricBlock({ impedance: userSprings(0.05) });
  const input = parsed(doc);
  const model = buildModel(input);
  const nominal = runSoilCase(model, 1);
  const totalMass = model.massProperties.totalMass;
  const fz = Math.sqrt(KZ / totalMass) / (2 * Math.PI);
  const resonanceRpm = fz * 60;
  // Chopra (methods.md section 3): rotating mass, A_max = (m_e e / m) / (2 zeta sqrt(1 - zeta^2))
  const rotor = model.rotors[0]!;
  const me = rotor.forceAtRated / rotor.omegaRated ** 2;
  const aMax = me / totalMass / (2 * 0.05 * Math.sqrt(1 - 0.05 ** 2));

  it("at constant speed, from rest, the coupled rotating case settles on the harmonic steady state at every bearing", () => {
    // bearings off the axis couple y, z with the rotations
    const offset = parsed(
      symmetricBlock({
        impedance: userSprings(0.05),
        rotor: { bearings: [[-1, 0.5, 2.2], [1, 0.5, 2.4]] },
      }),
    );
    const m = buildModel(offset);
    const sc = runSoilCase(m, 1);
    const r = m.rotors[0]!;
    const loadIndex = r.loads.findIndex((l) => l.case === "rotating");
    const harmonic = sc.rotors[0]!.cases[loadIndex]!;
    expect(harmonic.case).toBe("rotating");
    for (const start of ["rest", "steady"] as const) {
      const run = integrateRun(m, sc, { rotor: r, loadIndex, fromRpm: 1500, toRpm: 1500, durationS: 8, outputPoints: 200, start, stepsPerPeriod: 100 });
      for (let p = 0; p < 2; p++) {
        const expected = Math.max(...harmonic.points[p]!.displacementPeak);
        const last = run.displacementPeak[p]!.at(-1)!;
        expect(relClose(last, expected, 5e-3)).toBe(true);
        // started on the steady state, the first output interval is already on it
        if (start === "steady") expect(relClose(run.displacementPeak[p]![0]!, expected, 5e-3)).toBe(true);
        // from rest the start overshoots or undershoots before it settles
        if (start === "rest") expect(Math.abs(run.displacementPeak[p]![0]! / expected - 1)).toBeGreaterThan(0.01);
      }
    }
  });

  it("the steady-state maximum it reports is Chopra's rotating-mass peak", () => {
    const run = transientRun(model, nominal, {
      machine: "M",
      rotor: "R",
      kind: "run-up",
      fromRpm: 300,
      toRpm: 1500,
      durationS: 2,
      case: "vertical",
      outputPoints: 100,
    });
    expect(relClose(run.steadyStateMax.displacementPeak, aMax, 1e-4)).toBe(true);
    // peak at r = 1 / sqrt(1 - 2 zeta^2)
    expect(relClose(run.steadyStateMax.atRpm, resonanceRpm / Math.sqrt(1 - 2 * 0.05 ** 2), 1e-3)).toBe(true);
  });

  it("a very slow run-up reproduces the harmonic peak (quasi-static sweep limit)", () => {
    const run = runOf(doc, { machine: "M", rotor: "R", kind: "run-up", fromRpm: 300, toRpm: 1500, durationS: 60, case: "vertical" });
    expect(relClose(run.peakDisplacement.value, run.steadyStateMax.displacementPeak, 0.02)).toBe(true);
    expect(relClose(run.peakDisplacement.atRpm, resonanceRpm, 0.03)).toBe(true);
    expect(relClose(run.peakDisplacement.value, run.peakDisplacement.steadyStateAtSameSpeed, 0.05)).toBe(true);
    expect(relClose(run.peakVelocity.value, run.steadyStateMax.velocityPeak, 0.02)).toBe(true);
    expect(run.series.timeS).toHaveLength(500);
    expect(run.series.displacementPeak[0]).toHaveLength(500);
    expect(Math.max(...run.series.displacementPeak[0]!)).toBe(run.peakDisplacement.value);
  });

  it("a fast run-up peaks lower than the steady-state resonance and above the resonance speed; a fast coast-down below it", () => {
    // Passage through resonance (Lewis, F. M. 1932, "Vibration during acceleration through a
    // critical speed", Trans. ASME 54; recalled from memory): the faster the passage, the lower
    // the maximum, which lags behind the resonance, above it when speeding up, below it when
    // slowing down.
    const up = runOf(doc, { machine: "M", rotor: "R", kind: "run-up", fromRpm: 300, toRpm: 1500, durationS: 1, case: "vertical" });
    const down = runOf(doc, { machine: "M", rotor: "R", kind: "coast-down", fromRpm: 1500, toRpm: 300, durationS: 1, case: "vertical" });
    for (const run of [up, down]) expect(run.peakDisplacement.value).toBeLessThan(0.8 * run.steadyStateMax.displacementPeak);
    expect(up.peakDisplacement.atRpm).toBeGreaterThan(1.1 * resonanceRpm);
    expect(down.peakDisplacement.atRpm).toBeLessThan(0.9 * resonanceRpm);
    const medium = runOf(doc, { machine: "M", rotor: "R", kind: "run-up", fromRpm: 300, toRpm: 1500, durationS: 5, case: "vertical" });
    expect(medium.peakDisplacement.value).toBeGreaterThan(up.peakDisplacement.value);
    expect(medium.peakDisplacement.value).toBeLessThan(medium.steadyStateMax.displacementPeak);
  });

  it("the fast run-up's peak agrees with a classical Runge-Kutta integration of the vertical oscillator", () => {
    // Independent method: fourth-order Runge-Kutta (Kutta 1901) on m u'' + c u' + k u = f(t), the
    // vertical DOF alone (it decouples on this block), f = m e (w^2 cos phi + alpha sin phi).
    const run = runOf(doc, { machine: "M", rotor: "R", kind: "run-up", fromRpm: 300, toRpm: 1500, durationS: 1, case: "vertical" });
    const k = run.model.stiffness.z;
    const c = run.model.dashpot.z;
    const m = totalMass;
    const w0 = rpmToRadPerSec(300);
    const alpha = run.angularAcceleration;
    const force = (t: number) => {
      const w = w0 + alpha * t;
      const phi = w0 * t + 0.5 * alpha * t * t;
      return me * (w * w * Math.cos(phi) + alpha * Math.sin(phi));
    };
    // start on the steady state at 300 rpm, as the engine does: U = F0 / (k - w0^2 m + i w0 c)
    const F0 = me * w0 * w0;
    const den = (k - w0 * w0 * m) ** 2 + (w0 * c) ** 2;
    let u = (F0 * (k - w0 * w0 * m)) / den;
    let v = -w0 * ((-F0 * w0 * c) / den);
    const acc = (t: number, x: number, y: number) => (force(t) - c * y - k * x) / m;
    const steps = 20000;
    const h = 1 / steps;
    let peak = Math.abs(u);
    for (let n = 0; n < steps; n++) {
      const t = n * h;
      const k1u = v;
      const k1v = acc(t, u, v);
      const k2u = v + (h / 2) * k1v;
      const k2v = acc(t + h / 2, u + (h / 2) * k1u, v + (h / 2) * k1v);
      const k3u = v + (h / 2) * k2v;
      const k3v = acc(t + h / 2, u + (h / 2) * k2u, v + (h / 2) * k2v);
      const k4u = v + h * k3v;
      const k4v = acc(t + h, u + h * k3u, v + h * k3v);
      u += (h / 6) * (k1u + 2 * k2u + 2 * k3u + k4u);
      v += (h / 6) * (k1v + 2 * k2v + 2 * k3v + k4v);
      peak = Math.max(peak, Math.abs(u));
    }
    expect(relClose(run.peakDisplacement.value, peak, 0.01)).toBe(true);
  });
});

describe("transient runs in the analysis", () => {
  const doc = symmetricBlock({ impedance: userSprings(0.05) });

  it("are present only when asked for, with default speeds from standstill to the rated speed", () => {
    expect(analyse(parsed(doc)).transient).toBeUndefined();
    const run = runOf(doc, { machine: "M", rotor: "R", kind: "run-up", durationS: 3, outputPoints: 50 });
    expect([run.fromRpm, run.toRpm]).toEqual([0, 1500]);
    expect(run.case).toBe("rotating");
    expect(run.unbalanceMode).toBe("static");
    expect(run.series.speedRpm).toHaveLength(50);
    // the speed rises linearly: the middle of the last interval is just below the rated speed
    expect(run.series.speedRpm.at(-1)!).toBeLessThan(1500);
    expect(run.series.speedRpm.at(-1)!).toBeGreaterThan(1450);
    // from rest the block starts still: the first interval's peak is far below the run's
    expect(run.series.displacementPeak[0]![0]!).toBeLessThan(0.01 * run.peakDisplacement.value);
    expect(run.angularAcceleration).toBeCloseTo(rpmToRadPerSec(1500) / 3, 9);
  });

  it("analyseTransient gives the same run on its own", () => {
    const request = { machine: "M", rotor: "R", kind: "coast-down" as const, durationS: 2, case: "horizontal" as const, outputPoints: 40 };
    const alone = analyseTransient(parsed(doc), request);
    expect(alone).toEqual(runOf(doc, request));
    expect([alone.fromRpm, alone.toRpm]).toEqual([1500, 0]);
  });

  it("coarsens the step with a warning beyond the step budget", () => {
    const input = parsed(doc);
    const model = buildModel(input);
    const run = transientRun(
      model,
      runSoilCase(model, 1),
      { machine: "M", rotor: "R", kind: "run-up", durationS: 10, case: "rotating", outputPoints: 100 },
      2000,
    );
    expect(run.steps).toBe(2000);
    expect(run.stepsPerShortestPeriod).toBeLessThan(10);
    expect(run.warnings.join(" ")).toMatch(/steps per shortest period.*unreliable/);
  });

  it("say when Gazetas' springs and dashpots are frozen and material damping is made viscous", () => {
    const gazetas = JSON.parse(readFileSync(path.resolve(import.meta.dirname, "../../../examples/gazetas-embedded.json"), "utf8"));
    const machine = gazetas.machines[0];
    const result = analyse(
      parsed({ ...gazetas, transient: [{ machine: machine.name, rotor: machine.rotors[0].name, kind: "run-up", durationS: 4, outputPoints: 20 }] }),
    );
    const run = result.transient![0]!;
    expect(run.warnings.join(" ")).toMatch(/frozen at the rated speed/);
    expect(result.warnings).toEqual(expect.arrayContaining(run.warnings));
    // viscous material damping 2 beta K / w_ref added to the radiation dashpots
    const beta = gazetas.soil.materialDamping;
    const wRef = rpmToRadPerSec(machine.rotors[0].speedRpm);
    expect(relClose(run.model.dashpot.z - result.impedance.dashpot!.z, (2 * beta * run.model.stiffness.z) / wRef, 1e-9)).toBe(true);
  });
});

describe("transient request validation", () => {
  const doc = symmetricBlock({ impedance: userSprings(0.05) });
  const good = { machine: "M", rotor: "R", kind: "run-up", durationS: 10 };

  function expectIssue(request: Json, at: string, message?: RegExp) {
    const p = parseAnalysisInput({ ...doc, transient: [good, request] });
    if (p.ok) throw new Error("expected the input to be refused");
    const hit = p.issues.find((i) => i.path === at);
    expect(hit, JSON.stringify(p.issues)).toBeDefined();
    if (message) expect(hit!.message).toMatch(message);
  }

  it("refuses unknown machine and rotor names at their path", () => {
    expectIssue({ ...good, machine: "Fan" }, "transient[1].machine", /no machine is named "Fan"/);
    expectIssue({ ...good, rotor: "Impeller" }, "transient[1].rotor", /no rotor named "Impeller"/);
  });

  it("refuses speeds, durations and output sizes out of range", () => {
    expectIssue({ ...good, fromRpm: -10 }, "transient[1].fromRpm", /0 or more/);
    expectIssue({ ...good, durationS: 0 }, "transient[1].durationS", /greater than 0/);
    expectIssue({ ...good, durationS: 3600 }, "transient[1].durationS", /at most 600/);
    expectIssue({ ...good, outputPoints: 5000 }, "transient[1].outputPoints", /at most 2000/);
    expectIssue({ ...good, kind: "spin" }, "transient[1].kind");
    expectIssue({ ...good, case: "axial" }, "transient[1].case");
  });

  it("refuses a run going the wrong way for its kind", () => {
    expectIssue({ ...good, fromRpm: 1200, toRpm: 600 }, "transient[1].toRpm", /run-up needs toRpm/);
    // coast-down from the default rated speed (1500 rpm) to 1800 rpm
    expectIssue({ ...good, kind: "coast-down", toRpm: 1800 }, "transient[1].toRpm", /coast-down needs fromRpm/);
    expectIssue({ ...good, kind: "coast-down", fromRpm: 0 }, "transient[1].fromRpm", /coast-down needs fromRpm/);
  });

  it("refuses an unbalance mode the rotor does not have, unknown fields and an empty list", () => {
    expectIssue({ ...good, unbalanceMode: "couple" }, "transient[1].unbalanceMode", /"static"/);
    expectIssue({ ...good, torque: 5 }, "transient[1].torque", /unknown field/);
    const p = parseAnalysisInput({ ...doc, transient: [] });
    expect(!p.ok && p.issues.some((i) => i.path === "transient")).toBe(true);
  });

  it("analyseTransient refuses a bad request with paths relative to it", () => {
    try {
      analyseTransient(parsed(doc), { machine: "M", rotor: "Nope", kind: "run-up", durationS: 5 });
      expect.unreachable("the request should be refused");
    } catch (e) {
      expect(e).toBeInstanceOf(TransientRequestError);
      expect((e as TransientRequestError).issues.map((i) => i.path)).toEqual(["rotor"]);
    }
  });
});
