// The search: every combination of the allowed dimensions (multiples of each step within its
// bounds) that holds what the mat carries, taken in order of ascending concrete volume and
// analysed by the calculation core until the requested number pass every check. Because the
// order is by volume, the first candidate that passes is the smallest passing block of the
// grid, and any proposal found before the analysis cap is reached is exact in that sense.
//
// Two checks are closed-form in the contract's own definitions and are applied before the
// core is called, so candidates that cannot pass do not spend analyses: the mass ratio
// (rho V_net / machine mass) and the static bearing pressure ((rho V_net + machine mass) g / A,
// A = L W for a mat without voids at its underside). A candidate is skipped only when it misses
// by more than a relative 1e-9; borderline ones go to the core, which has the last word.
import { bandCheckId, CRITERIA_DEFAULTS, nominalCheckId, parseAnalysisInput, type AnalysisInput, type CheckResult } from "@/modules/calc";
import { STANDARD_GRAVITY } from "@/modules/calc/criteria-defaults";
import { checkUtilisation } from "@/modules/desk/foundation-summary";
import { concreteVolume, minimumFit, readBaseMat, LENGTH_TOLERANCE_M, type BaseMat, type MatDimensions } from "./base-mat";
import { checkMargin, clearsWithMargin, evaluateCandidate, type Evaluation } from "./evaluate";
import { gridValues, MODULE_SIZING_LIMITS, parseSizingOptions, roundLength, type CentreMode, type SizingLimits, type SizingOptions } from "./options";
import { formatSignificant } from "@/modules/units/format-number";
import { matCentre, placementFor, resizeDocument, type Placement } from "./resize";

/** Relative miss below which a closed-form pre-check leaves the candidate to the core. */
const PRUNE_TOLERANCE = 1e-9;

export interface SizingIssue {
  /** Which argument the problem is in. */
  in: "input" | "options" | "proposal";
  path: string;
  message: string;
}

export interface CheckSummary {
  id: string;
  key: string;
  label: string;
  value: number;
  limit: number;
  unit: string;
  /** Distance from the limit as a share of the limit, positive on the passing side (see checkMargin). */
  margin: number;
}

export interface SizingProposal {
  /** 1 for the smallest block. */
  rank: number;
  dimensions: MatDimensions;
  /** Net concrete volume of the whole block, voids subtracted (m^3). */
  concreteVolume: number;
  blockMass: number;
  massRatio: number;
  /** The check with the highest utilisation (the project page's governing check). */
  governing: CheckSummary;
  /** Smallest rated speed over natural frequency, over all rotors and modes (null without rotors). */
  lowestFrequencyRatio: number | null;
  /** Smallest |r - 1| over every operating range (soil band included when required; null without rotors). */
  smallestSeparation: number | null;
  naturalFrequenciesHz: number[];
  checksPassed: number;
  /** The core's warnings for this block (e.g. a slender or thin block, a rule of thumb). */
  warnings: string[];
  placement: Placement & { mode: CentreMode };
}

export interface FailureCount {
  id: string;
  name: string;
  /** Candidates (analysed or skipped by a closed-form check) that fail this check. */
  candidates: number;
  /** What to change, in a sentence. */
  hint: string;
}

export interface NearestCandidate {
  dimensions: MatDimensions;
  concreteVolume: number;
  /** Where the mat goes, as for a proposal, so the candidate can be loaded like one. */
  placement: Placement & { mode: CentreMode };
  /** The failing checks, worst first. */
  failing: CheckSummary[];
}

export interface SizingResult {
  found: boolean;
  /** One paragraph for the engineer. */
  message: string;
  /** Ascending concrete volume. */
  proposals: SizingProposal[];
  analysesRun: number;
  maxAnalyses: number;
  /** The analysis cap ended the search before enough proposals were found. */
  capped: boolean;
  current: { dimensions: MatDimensions; concreteVolume: number };
  /** The least mat that holds the plinths, voids and machines (thickness: the deepest void, to be exceeded). */
  minimumFit: MatDimensions;
  candidates: {
    /** Combinations of the allowed values. */
    total: number;
    /** Those too small for what the mat carries. */
    doNotFit: number;
    /** Failed the mass ratio or bearing pressure in closed form, without an analysis. */
    skippedClosedForm: number;
    analysed: number;
    /** Not reached: the search stopped (enough proposals, or the cap). */
    notReached: number;
    /** Largest concrete volume whose candidates were all examined (m^3), null before any. */
    examinedUpToVolume: number | null;
  };
  /** Checks that failed, most frequent first. */
  failures: FailureCount[];
  /** Assumptions of this search that the engineer should know (user springs, embedment). */
  notes: string[];
  /** When nothing passed: the candidate closest to passing (fewest failing checks, then the smallest overshoot). */
  nearest: NearestCandidate | null;
  options: SizingOptions;
}

export type SizingOutcome = { ok: true; result: SizingResult } | { ok: false; issues: SizingIssue[] };

const CHECK_WORDS: Record<string, { name: string; hint: string }> = {
  "mass-ratio": {
    name: "mass ratio",
    hint: "the block is too light for the machines: raise the upper bound of the length, width or thickness",
  },
  "bearing-pressure": {
    name: "bearing pressure",
    hint: "the base presses too hard on the soil: allow a longer or wider mat (a thicker one only adds weight)",
  },
  eccentricity: {
    name: "eccentricity",
    hint: 'the combined centre of gravity is off the base centre: centre the mat on the load (centre "load") or move the plinths',
  },
  "frequency-separation": {
    name: "frequency separation",
    hint: "a natural frequency lies near an operating speed: try other ranges of dimensions (more mass lowers the frequencies, a larger plan stiffens the soil) or review the soil and impedance inputs",
  },
  [bandCheckId("frequency-separation", "lower")]: {
    name: "frequency separation at the lower soil bound",
    hint: "a natural frequency at the lower soil modulus lies near an operating speed: try other ranges of dimensions or review the band factors",
  },
  [bandCheckId("frequency-separation", "upper")]: {
    name: "frequency separation at the upper soil bound",
    hint: "a natural frequency at the upper soil modulus lies near an operating speed: try other ranges of dimensions or review the band factors",
  },
  displacement: {
    name: "displacement",
    hint: "the response is too large: allow a heavier, larger block, and check the unbalance data and service factor",
  },
  velocity: {
    name: "velocity",
    hint: "the response is too large: allow a heavier, larger block, and check the unbalance data and service factor",
  },
  // rotors responding together (issue 18 item 7)
  "displacement-combined": {
    name: "combined displacement of rotors responding together",
    hint: "the rotors together move the block too much: allow a heavier, larger block, and check the unbalance data and service factors",
  },
  "velocity-combined": {
    name: "combined velocity of rotors responding together",
    hint: "the rotors together move the block too much: allow a heavier, larger block, and check the unbalance data and service factors",
  },
};

function words(id: string): { name: string; hint: string } {
  const own = CHECK_WORDS[id];
  if (own) return own;
  // displacement and velocity at a soil bound: the nominal check's words, with the bound named
  const nominal = CHECK_WORDS[nominalCheckId({ id })];
  const bound = /@soil-(lower|upper)$/.exec(id)?.[1];
  if (nominal && bound) return { name: `${nominal.name} at the ${bound} soil bound`, hint: nominal.hint };
  return { name: id, hint: "review this check's inputs" };
}

function summarise(c: CheckResult): CheckSummary {
  return { id: c.id, key: c.key ?? c.id, label: c.label, value: c.value, limit: c.limit, unit: c.unit ?? "", margin: checkMargin(c) };
}

interface Candidate {
  dimensions: MatDimensions;
  volume: number;
}

function valuesFor(range: SizingOptions["dimensions"]["length"], current: number): number[] {
  return range ? gridValues(range.min, range.max, range.step) : [roundLength(current)];
}

/** Every combination that holds what the mat carries, by ascending volume (then L, W, T). */
function enumerate(mat: BaseMat, options: SizingOptions, need: MatDimensions): { fit: Candidate[]; total: number } {
  const lengths = valuesFor(options.dimensions.length, mat.dimensions.length);
  const widths = valuesFor(options.dimensions.width, mat.dimensions.width);
  const thicknesses = valuesFor(options.dimensions.thickness, mat.dimensions.thickness);
  const fit: Candidate[] = [];
  for (const length of lengths) {
    if (length < need.length - LENGTH_TOLERANCE_M) continue;
    for (const width of widths) {
      if (width < need.width - LENGTH_TOLERANCE_M) continue;
      for (const thickness of thicknesses) {
        if (!(thickness > need.thickness + LENGTH_TOLERANCE_M)) continue;
        const dimensions = { length, width, thickness };
        fit.push({ dimensions, volume: concreteVolume(mat, dimensions) });
      }
    }
  }
  fit.sort(
    (a, b) =>
      a.volume - b.volume ||
      a.dimensions.length - b.dimensions.length ||
      a.dimensions.width - b.dimensions.width ||
      a.dimensions.thickness - b.dimensions.thickness,
  );
  return { fit, total: lengths.length * widths.length * thicknesses.length };
}

/** Checks that the candidate fails in closed form (contract definitions), if any. */
function closedFormFailures(input: AnalysisInput, mat: BaseMat, c: Candidate, margin: number): string[] {
  const out: string[] = [];
  // the required margin moves each limit inward, as checkMargin measures it
  const minFactor = 1 + margin;
  const maxFactor = 1 - margin;
  const blockMass = mat.concreteDensity * c.volume;
  const minMassRatio = input.criteria?.minMassRatio ?? CRITERIA_DEFAULTS.minMassRatio.value;
  if (blockMass / mat.machineMass < minMassRatio * minFactor * (1 - PRUNE_TOLERANCE)) out.push("mass-ratio");
  const maxBearingRatio = input.criteria?.maxBearingRatio ?? CRITERIA_DEFAULTS.maxBearingRatio.value;
  const pressure = ((blockMass + mat.machineMass) * STANDARD_GRAVITY) / (c.dimensions.length * c.dimensions.width);
  // under springs and piles the bearing-pressure check is not applicable (checks.ts markNotApplicable): no pruning on it
  const bearingApplies = input.impedance.method !== "springs" && input.impedance.method !== "piles";
  if (bearingApplies && pressure / input.soil.allowableBearingPressure > maxBearingRatio * maxFactor * (1 + PRUNE_TOLERANCE)) out.push("bearing-pressure");
  return out;
}

function worstFirst(checks: CheckResult[]): CheckResult[] {
  return [...checks].sort((a, b) => checkUtilisation(b) - checkUtilisation(a));
}

function proposalFrom(rank: number, c: Candidate, e: Evaluation, mat: BaseMat, mode: CentreMode): SizingProposal {
  const governing = worstFirst(e.checks)[0];
  if (!governing) throw new Error("a passing candidate has no checks");
  const ratios = e.result.rotors.flatMap((r) => r.frequencyRatios);
  const separations = e.checks.filter((ch) => nominalCheckId(ch) === "frequency-separation").map((ch) => ch.value);
  return {
    rank,
    dimensions: c.dimensions,
    concreteVolume: c.volume,
    blockMass: e.result.massProperties.blockMass,
    massRatio: e.result.massProperties.massRatio,
    governing: summarise(governing),
    lowestFrequencyRatio: ratios.length > 0 ? Math.min(...ratios) : null,
    smallestSeparation: separations.length > 0 ? Math.min(...separations) : null,
    naturalFrequenciesHz: e.result.modes.map((m) => m.frequencyHz),
    checksPassed: e.checks.length,
    warnings: e.result.warnings,
    placement: { mode, ...placementFor(mat, mode, c.dimensions) },
  };
}

/** Lower is closer to passing: fewer failing checks, then a smaller worst utilisation. */
function distance(e: Evaluation, margin: number): [number, number] {
  const worst = worstFirst(e.checks.filter((c) => !clearsWithMargin(c, margin)))[0];
  return [e.failingIds.length, worst ? checkUtilisation(worst) : 0];
}

// SI figures through the one formatter (the panel writes its own text in the project's units)
const fmt = (v: number, digits: 3 | 4 = 4) => formatSignificant(v, { digits });
// a margin of a few hundredths of a per cent is worth showing as such, not as "0.0"
const percent = (share: number) => (Math.abs(share * 100) >= 1 ? (share * 100).toFixed(1) : (share * 100).toPrecision(2));
const dims = (d: MatDimensions) => `${fmt(d.length)} m x ${fmt(d.width)} m x ${fmt(d.thickness)} m`;

/**
 * Proposes base-mat dimensions that pass every check of the analysis, smallest concrete volume
 * first. `document` is an analysis input (contract v1); `options` see sizingOptionsSchema.
 */
export function proposeBlockSizes(document: unknown, options: unknown, limits: SizingLimits = MODULE_SIZING_LIMITS): SizingOutcome {
  const parsedOptions = parseSizingOptions(options, limits);
  const parsedInput = parseAnalysisInput(document);
  const issues: SizingIssue[] = [
    ...(parsedOptions.ok ? [] : parsedOptions.issues.map((i) => ({ in: "options" as const, ...i }))),
    ...(parsedInput.ok ? [] : parsedInput.issues.map((i) => ({ in: "input" as const, ...i }))),
  ];
  if (!parsedOptions.ok || !parsedInput.ok) return { ok: false, issues };
  const read = readBaseMat(parsedInput.input);
  if (!read.ok) return { ok: false, issues: read.issues.map((i) => ({ in: "input", ...i })) };
  const steps = search(parsedInput.input, read.mat, parsedOptions.options);
  for (;;) {
    const step = steps.next();
    if (step.done) return { ok: true, result: step.value };
  }
}

/**
 * The same search, handing the thread back between slices of analyses, so that a server
 * answering a sizing request keeps answering its other requests meanwhile (a search may run
 * several hundred analyses of a few milliseconds each).
 */
export async function proposeBlockSizesAsync(
  document: unknown,
  options: unknown,
  { sliceMs = 20, limits = MODULE_SIZING_LIMITS }: { sliceMs?: number; limits?: SizingLimits } = {},
): Promise<SizingOutcome> {
  const parsedOptions = parseSizingOptions(options, limits);
  const parsedInput = parseAnalysisInput(document);
  if (!parsedOptions.ok || !parsedInput.ok) return proposeBlockSizes(document, options, limits);
  const read = readBaseMat(parsedInput.input);
  if (!read.ok) return { ok: false, issues: read.issues.map((i) => ({ in: "input", ...i })) };
  const steps = search(parsedInput.input, read.mat, parsedOptions.options);
  let sliceStart = Date.now();
  for (;;) {
    const step = steps.next();
    if (step.done) return { ok: true, result: step.value };
    if (Date.now() - sliceStart >= sliceMs) {
      await new Promise<void>((resolve) => setTimeout(resolve, 0));
      sliceStart = Date.now();
    }
  }
}

/** The search itself; it yields after every analysis so a driver may pause between them. */
function* search(input: AnalysisInput, mat: BaseMat, options: SizingOptions): Generator<void, SizingResult, void> {
  const mode = options.centre;
  const need = minimumFit(mat, matCentre(mat, mode));
  const { fit, total } = enumerate(mat, options, need);
  const analyseCandidate = (c: Candidate): Evaluation => {
    // the parsed input is itself a valid document (defaults written out)
    const out = evaluateCandidate(resizeDocument(input, mat, mode, c.dimensions), options.requireSoilBand, options.margin);
    // The resizer keeps every rule of the core (no overlap, voids inside, O at the origin),
    // so a refusal here is a defect of this module, not of the user's input.
    if (!out.ok) throw new Error(`resized block refused by the core: ${JSON.stringify(out.issues)}`);
    return out.evaluation;
  };

  const failures = new Map<string, number>();
  const tally = (ids: string[]) => ids.forEach((id) => failures.set(id, (failures.get(id) ?? 0) + 1));
  const proposals: SizingProposal[] = [];
  let analysesRun = 0;
  let skipped = 0;
  let capped = false;
  let examined = 0;
  let nearest: { c: Candidate; e: Evaluation; d: [number, number] } | null = null;

  for (const c of fit) {
    if (proposals.length >= options.proposals) break;
    const closed = closedFormFailures(input, mat, c, options.margin);
    if (closed.length > 0) {
      skipped++;
      examined++;
      tally(closed);
      continue;
    }
    if (analysesRun >= options.maxAnalyses) {
      capped = true;
      break;
    }
    const e = analyseCandidate(c);
    analysesRun++;
    examined++;
    yield;
    if (e.pass) {
      proposals.push(proposalFrom(proposals.length + 1, c, e, mat, mode));
      continue;
    }
    tally(e.failingIds);
    const d = distance(e, options.margin);
    if (!nearest || d[0] < nearest.d[0] || (d[0] === nearest.d[0] && d[1] < nearest.d[1])) nearest = { c, e, d };
  }
  // Nothing analysed (every candidate failed in closed form): let the core confirm on the
  // largest block in the bounds, so the answer shows the core's own figures.
  const largest = fit[fit.length - 1];
  if (proposals.length === 0 && !nearest && largest && analysesRun < options.maxAnalyses) {
    const e = analyseCandidate(largest);
    analysesRun++;
    nearest = { c: largest, e, d: distance(e, options.margin) };
  }

  const failureList: FailureCount[] = [...failures.entries()]
    .map(([id, candidates]) => ({ id, candidates, ...words(id) }))
    .sort((a, b) => b.candidates - a.candidates || a.id.localeCompare(b.id));
  const current = { dimensions: mat.dimensions, concreteVolume: concreteVolume(mat, mat.dimensions) };
  const lastExamined = examined > 0 ? fit[examined - 1] : undefined;
  const result: SizingResult = {
    found: proposals.length > 0,
    message: "",
    proposals,
    analysesRun,
    maxAnalyses: options.maxAnalyses,
    capped,
    current,
    minimumFit: need,
    candidates: {
      total,
      doNotFit: total - fit.length,
      skippedClosedForm: skipped,
      analysed: examined - skipped,
      notReached: fit.length - examined,
      examinedUpToVolume: lastExamined ? lastExamined.volume : null,
    },
    failures: failureList,
    notes: notesFor(input, options),
    nearest:
      proposals.length === 0 && nearest
        ? {
            dimensions: nearest.c.dimensions,
            concreteVolume: nearest.c.volume,
            placement: { mode, ...placementFor(mat, mode, nearest.c.dimensions) },
            failing: worstFirst(nearest.e.checks.filter((ch) => !clearsWithMargin(ch, options.margin))).map(summarise),
          }
        : null,
    options,
  };
  result.message = describe(result, need);
  return result;
}

function notesFor(input: AnalysisInput, options: SizingOptions): string[] {
  const notes: string[] = [];
  if (input.impedance.method === "springs") {
    notes.push("The block is on steel springs: the springs' positions and stiffness were kept as entered for every size; the number and layout of springs are the designer's.");
    if (input.impedance.base) notes.push("The springs stand on a base block: the base was kept as entered for every size (only the block on the springs is resized); check that the springs still stand on it.");
  }
  if (input.impedance.method === "user") {
    notes.push(
      "The impedance is user-entered: its springs and damping ratios were kept as entered for every size, although they depend on the base; have them recomputed for the proposed base.",
    );
  }
  if (options.dimensions.thickness && input.soil.embedmentDepth > 0) {
    notes.push(
      "The embedment depth and sidewall contact height were kept as entered for every thickness (the grade stays at the same height above the underside); adjust them if the top of the block is what stays at grade.",
    );
  }
  return notes;
}

function describe(r: SizingResult, need: MatDimensions): string {
  const parts: string[] = [];
  const first = r.proposals[0];
  if (first) {
    parts.push(
      `${r.proposals.length} proposal${r.proposals.length > 1 ? "s" : ""}; the smallest, ${dims(first.dimensions)} (${fmt(first.concreteVolume)} m³ of concrete against ${fmt(r.current.concreteVolume)} m³ now), passes all ${first.checksPassed} checks${r.options.margin > 0 ? ` with at least ${percent(r.options.margin)} % inside every limit` : ""}; governing: ${words(first.governing.id).name} with ${percent(first.governing.margin)} % of its limit to spare.`,
    );
  } else if (r.candidates.total === r.candidates.doNotFit) {
    parts.push(
      `No combination within the bounds holds the plinths, voids and machines: the mat needs a length of at least ${fmt(need.length)} m, a width of at least ${fmt(need.width)} m and a thickness over ${fmt(need.thickness)} m.`,
    );
  } else {
    const top = r.failures[0];
    const fitting = r.candidates.total - r.candidates.doNotFit;
    parts.push(
      r.capped
        ? "No block passed every check before the analysis cap stopped the search."
        : "No block within the bounds passes every check.",
    );
    if (top) parts.push(`Most often failing: ${top.name}, for ${top.candidates} of ${r.candidates.analysed + r.candidates.skippedClosedForm} candidates examined (${fitting} fit); ${top.hint}.`);
  }
  if (r.capped) {
    parts.push(
      `The cap of ${r.maxAnalyses} analyses stopped the search with ${r.candidates.notReached} candidates not reached${r.candidates.examinedUpToVolume === null ? "" : `; every candidate up to ${fmt(r.candidates.examinedUpToVolume)} m³ was examined`}. Raise the cap or narrow the bounds.`,
    );
  }
  parts.push(`${r.analysesRun} analyses run.`);
  return parts.join(" ");
}
