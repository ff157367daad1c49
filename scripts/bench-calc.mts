// Calculation-core benchmark sections, called by scripts/bench.mts. Other sections (e.g. the
// HTTP API) can reuse `timeRuns` and return the same `BenchSection` shape.
import { readFileSync } from "node:fs";
import path from "node:path";
import { performance } from "node:perf_hooks";
import { analyse, parseAnalysisInputText, type AnalysisInput } from "../modules/calc/index";
import { buildModel } from "../modules/calc/model";
import { soilBand } from "../modules/calc/soil-band";
import { proposeBlockSizes } from "../modules/sizing/index";

export interface TimingStats {
  median: number;
  min: number;
  max: number;
  p10: number;
  p90: number;
  runs: number;
}

export interface BenchSection {
  name: string;
  stats: TimingStats;
}

function quantile(sorted: number[], q: number): number {
  const pos = (sorted.length - 1) * q;
  const lo = Math.floor(pos);
  const hi = Math.ceil(pos);
  const a = sorted[lo] ?? 0;
  const b = sorted[hi] ?? a;
  return a + (b - a) * (pos - lo);
}

export function summarise(samplesMs: number[]): TimingStats {
  const s = [...samplesMs].sort((a, b) => a - b);
  return {
    median: quantile(s, 0.5),
    min: s[0] ?? 0,
    max: s[s.length - 1] ?? 0,
    p10: quantile(s, 0.1),
    p90: quantile(s, 0.9),
    runs: s.length,
  };
}

/** Times a synchronous function: `warmup` untimed calls, then `runs` timed ones (ms). */
export function timeRuns(fn: () => unknown, runs: number, warmup = Math.min(50, runs)): TimingStats {
  for (let i = 0; i < warmup; i++) fn();
  const samples: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    fn();
    samples.push(performance.now() - t0);
  }
  return summarise(samples);
}

/** The demo foundation: two machines on one block. */
export const DEFAULT_BENCH_INPUT = path.relative(process.cwd(), path.resolve(import.meta.dirname, "../examples/raw-water-pump-train.json"));

/**
 * Full analysis (modes, rated and speed-range responses, 600-point sweep of every rotor's
 * cases, soil band, checks) from a parsed input, and the soil band alone.
 */
export function benchCalc(inputPath: string, runs: number): { description: string; sections: BenchSection[] } {
  const parsed = parseAnalysisInputText(readFileSync(inputPath, "utf8"));
  if (!parsed.ok) {
    throw new Error(`${inputPath}: ${parsed.issues.map((i) => `${i.path}: ${i.message}`).join("; ")}`);
  }
  const input = parsed.input;
  const model = buildModel(input);
  const rotors = input.machines.reduce((n, m) => n + m.rotors.length, 0);
  const result = analyse(input);
  const description = `${inputPath}: ${input.machines.length} machine(s), ${rotors} rotor(s), ${result.sweep.frequencyHz.length}-point sweep, ${result.sweep.series.length} point series`;
  return {
    description,
    sections: [
      { name: "full analysis", stats: timeRuns(() => analyse(input), runs) },
      { name: "soil band (2 soil cases)", stats: timeRuns(() => soilBand(model), runs) },
      ...extraSections(input, runs),
    ],
  };
}

/**
 * The beyond-the-hand-calculation tools on the same foundation: a 10 s run-up of its first
 * rotor through resonance (Newmark), and a sizing search of its base mat (the demo's bounds).
 */
function extraSections(input: AnalysisInput, runs: number): BenchSection[] {
  const machine = input.machines.find((m) => m.rotors.length > 0);
  const rotor = machine?.rotors[0];
  const out: BenchSection[] = [];
  if (machine && rotor) {
    const withRun = { ...input, transient: [{ machine: machine.name, rotor: rotor.name, kind: "run-up" as const, durationS: 10, case: "rotating" as const, outputPoints: 500 }] };
    const reparsed = parseAnalysisInputText(JSON.stringify(withRun));
    if (reparsed.ok) {
      const steps = analyse(reparsed.input).transient?.[0];
      out.push({
        name: `run-up 0 to ${rotor.speedRpm} rpm in 10 s (${steps?.steps ?? "?"} Newmark steps)`,
        stats: timeRuns(() => analyse({ ...reparsed.input, sweep: { fromHz: 1, toHz: 2, points: 2 } }), Math.max(5, Math.floor(runs / 20)), 2),
      });
    }
  }
  const mat = input.block.solids.find((s) => !s.void && s.z[0] === 0);
  if (mat) {
    const [x0, x1] = mat.x;
    const [y0, y1] = mat.y;
    const [z0, z1] = mat.z;
    const options = {
      dimensions: {
        length: { min: round1((x1 - x0) * 0.9), max: round1((x1 - x0) * 1.2) },
        width: { min: round1((y1 - y0) * 0.9), max: round1((y1 - y0) * 1.2) },
        thickness: { min: round1(z1 - z0), max: round1(z1 - z0 + 0.4) },
      },
      requireSoilBand: true,
    };
    const probe = proposeBlockSizes(input, options);
    const analyses = probe.ok ? probe.result.analysesRun : 0;
    out.push({ name: `sizing search, soil band required (${analyses} analyses)`, stats: timeRuns(() => proposeBlockSizes(input, options), Math.max(3, Math.floor(runs / 100)), 1) });
  }
  return out;
}

function round1(v: number): number {
  return Math.round(v * 10) / 10;
}

