// Frequency-response series for plotting: at each sweep frequency ONE factorisation of S(w)
// serves every load vector of every rotor and case. The loop writes by index into output
// arrays preallocated at their full length, with no allocation per frequency.
import { forceAt, responseSet, type HarmonicSolver } from "./harmonic";
import type { Model } from "./model";
import type { SweepResult, SweepSeries, TransmissibilitySeries } from "./result-types";
import { linspace, type SweepSettings } from "./sweep-grid";

function fail(what: string, hz: number): never {
  throw new Error(`internal error: non-finite ${what} at ${hz} Hz in the sweep`);
}

export function frequencySweep(
  model: Model,
  solver: HarmonicSolver,
  settings: SweepSettings,
  modesHz: number[],
  separation: number,
): SweepResult {
  const freqs = linspace(settings.fromHz, settings.toHz, settings.points);
  const nf = freqs.length;
  const rotors = model.rotors;
  // Series index of (rotor, load, point) and of (rotor, load).
  const pointBase: number[] = [];
  const loadBase: number[] = [];
  let nPointSeries = 0;
  let nLoadSeries = 0;
  for (const r of rotors) {
    pointBase.push(nPointSeries);
    loadBase.push(nLoadSeries);
    nPointSeries += r.loads.length * r.points.length;
    nLoadSeries += r.loads.length;
  }
  // displacement series written in place (preallocated plain arrays: no copy afterwards)
  const dispSeries: number[][] = [];
  for (let i = 0; i < nPointSeries; i++) dispSeries.push(new Array<number>(nf));
  const transSeries: number[][] = [];
  for (let i = 0; i < nLoadSeries; i++) transSeries.push(new Array<number>(nf));
  const u = responseSet(Math.max(0, ...rotors.map((r) => r.loads.length)));
  const maxPoints = Math.max(1, ...rotors.map((r) => r.points.length));
  const amp = new Float64Array(3 * maxPoints);
  for (let f = 0; f < nf; f++) {
    const hz = freqs[f] as number;
    const omega = 2 * Math.PI * hz;
    solver.setFrequency(omega);
    for (let r = 0; r < rotors.length; r++) {
      const rotor = rotors[r] as (typeof rotors)[number];
      const np = rotor.points.length;
      const force = forceAt(rotor.forceAtRated, rotor.omegaRated, omega);
      solver.solveAll(rotor.loads, u);
      for (let l = 0; l < rotor.loads.length; l++) {
        const base = (pointBase[r] as number) + l * np;
        solver.pointAmplitudes(u, l, rotor.pointCoords, force, amp, false);
        for (let i = 0; i < np; i++) {
          const d = amp[i] as number;
          if (!(d < Infinity)) fail("displacement", hz);
          (dispSeries[base + i] as number[])[f] = d;
        }
        // transmissibility: |reaction| of the unit-amplitude load
        const t = solver.transmittedForce(u, l, 1, null);
        if (!(t < Infinity)) fail("transmissibility", hz);
        (transSeries[(loadBase[r] as number) + l] as number[])[f] = t;
      }
    }
  }
  const omegas = new Float64Array(nf);
  for (let f = 0; f < nf; f++) omegas[f] = 2 * Math.PI * (freqs[f] as number);
  const series: SweepSeries[] = [];
  const transmissibility: TransmissibilitySeries[] = [];
  rotors.forEach((rotor, r) => {
    rotor.loads.forEach((load, l) => {
      const id = { machine: rotor.machine, rotor: rotor.rotor, case: load.case, unbalanceMode: load.unbalanceMode };
      rotor.points.forEach((p, i) => {
        const displacementPeak = dispSeries[(pointBase[r] as number) + l * rotor.points.length + i] as number[];
        const velocityPeak = new Array<number>(nf);
        for (let k = 0; k < nf; k++) velocityPeak[k] = (displacementPeak[k] as number) * (omegas[k] as number);
        series.push({ ...id, point: p.name, displacementPeak, velocityPeak });
      });
      transmissibility.push({ ...id, values: transSeries[(loadBase[r] as number) + l] as number[] });
    });
  });
  return {
    frequencyHz: freqs,
    series,
    transmissibility,
    operatingRangesHz: rotors.map((r) => ({
      machine: r.machine,
      rotor: r.rotor,
      fromHz: r.rangeRpm[0] / 60,
      toHz: r.rangeRpm[1] / 60,
      ratedHz: r.speedRpm / 60,
    })),
    avoidanceBandsHz: modesHz.map((f, i) => ({ mode: i + 1, fromHz: f * (1 - separation), toHz: f * (1 + separation) })),
  };
}
