// The difference between two revisions: inputs and results flattened into paths
// (`soil.poissonRatio`, `machines["Motor"].rotors["rotor"].mass`), every leaf that was
// added, removed or changed with its old and new value, and for numbers the absolute
// and per-cent change. Array members that carry a unique name (boxes, machines,
// rotors, result points, checks) are matched by that name, so reordering them is not
// a change; other arrays (coordinates, bearings, modes) are compared position by position.
import { checkVerdict, type AnalysisResult, type CheckResult, type CheckVerdict, type TransientResult } from "@/modules/calc";

export type LeafValue = number | string | boolean | null;

export type DiffKind = "added" | "removed" | "changed";

export interface DiffEntry {
  /** Where the value is, e.g. `block.solids["mat"].x[1]`. */
  path: string;
  /** The top-level member the path is under (`soil`, `massProperties` …), for folding. */
  group: string;
  kind: DiffKind;
  old?: LeafValue;
  new?: LeafValue;
  /** new − old, for two numbers. */
  absoluteChange?: number;
  /** (new − old) / |old| × 100, for two numbers with old ≠ 0. */
  percentChange?: number;
}

export interface SectionDiff {
  entries: DiffEntry[];
  /** How many leaves are equal (within tolerance), per group, so the UI can fold them. */
  unchanged: Record<string, number>;
}

export interface CheckFlip {
  key: string;
  label: string;
  source: string;
  unit?: string;
  oldPass: boolean;
  newPass: boolean;
  /** pass, fail or accepted (failed, accepted with a justification): a change of verdict is a flip too. */
  oldVerdict: CheckVerdict;
  newVerdict: CheckVerdict;
  /** The newer revision's justification of an accepted band check. */
  justification?: string;
  /** Soil bound of a band check (absent at nominal soil). */
  soilCase?: "lower" | "upper";
  oldValue: number;
  newValue: number;
  oldLimit: number;
  newLimit: number;
}

export interface RevisionDiff {
  /** Checks present in both whose verdict flipped: newly failing first, then newly passing. */
  flippedChecks: CheckFlip[];
  input: SectionDiff;
  result: SectionDiff;
}

export interface DiffOptions {
  /** Two numbers are equal when |a − b| <= relativeTolerance × max(|a|, |b|). Default 1e-9. */
  relativeTolerance?: number;
  /** … or when |a − b| <= absoluteTolerance. Default 0. */
  absoluteTolerance?: number;
}

interface Ctx {
  rel: number;
  abs: number;
  entries: DiffEntry[];
  unchanged: Record<string, number>;
}

// Identity of array members, tried in order; the first that every member on both
// sides has (as a string) and that is unique on each side wins. Start-up and coast-down
// runs (`transient`) carry a `kind`: a run's result by rotor, kind, case and unbalance, its
// input by rotor, kind and case (the unbalance mode may be left to the rotor's own).
const identities: readonly (readonly string[])[] = [
  ["key"],
  ["name"],
  ["machine", "rotor", "case", "unbalanceMode", "point"],
  ["machine", "rotor", "kind", "case", "unbalanceMode"],
  ["machine", "rotor", "kind", "case"],
  ["machine", "rotor", "case", "unbalanceMode"],
  ["machine", "rotor"],
  ["case", "unbalanceMode"],
  ["id"],
];

function isObject(v: unknown): v is Record<string, unknown> {
  return v !== null && typeof v === "object" && !Array.isArray(v);
}

function isLeaf(v: unknown): v is LeafValue {
  return v === null || typeof v === "number" || typeof v === "string" || typeof v === "boolean";
}

function identityOf(item: unknown, fields: readonly string[]): string | undefined {
  if (!isObject(item)) return undefined;
  const parts: string[] = [];
  for (const f of fields) {
    const v = item[f];
    if (typeof v !== "string") return undefined;
    parts.push(v);
  }
  return parts.join(" / ");
}

function chooseIdentity(a: readonly unknown[], b: readonly unknown[]): readonly string[] | undefined {
  if (a.length + b.length === 0) return undefined;
  for (const fields of identities) {
    const ok = [a, b].every((side) => {
      const ids = side.map((x) => identityOf(x, fields));
      return ids.every((id) => id !== undefined) && new Set(ids).size === ids.length;
    });
    if (ok) return fields;
  }
  return undefined;
}

function join(path: string, key: string): string {
  return path ? `${path}.${key}` : key;
}

function groupOf(path: string): string {
  return /^[^.[]+/.exec(path)?.[0] ?? "(root)";
}

function numbersEqual(a: number, b: number, ctx: Ctx): boolean {
  if (a === b) return true;
  if (!Number.isFinite(a) || !Number.isFinite(b)) return Object.is(a, b);
  const d = Math.abs(a - b);
  return d <= ctx.abs || d <= ctx.rel * Math.max(Math.abs(a), Math.abs(b));
}

function push(ctx: Ctx, entry: Omit<DiffEntry, "group">): void {
  ctx.entries.push({ ...entry, group: groupOf(entry.path) });
}

/** Every leaf of a value with its path, using the same array matching as the diff. */
function eachLeaf(value: unknown, path: string, visit: (path: string, leaf: LeafValue) => void): void {
  if (value === undefined) return;
  if (isLeaf(value)) {
    visit(path || "(root)", value);
    return;
  }
  if (Array.isArray(value)) {
    if (isStringList(value)) {
      for (const s of value) visit(path, s);
      return;
    }
    const fields = chooseIdentity(value, value);
    value.forEach((item, i) => eachLeaf(item, `${path}[${fields ? JSON.stringify(identityOf(item, fields)) : i}]`, visit));
    return;
  }
  if (isObject(value)) for (const [k, v] of Object.entries(value)) eachLeaf(v, join(path, k), visit);
}

// A list of free texts (warnings): compared as a set, members added or removed.
function isStringList(v: readonly unknown[]): v is string[] {
  return v.length > 0 && v.every((x) => typeof x === "string");
}

function walk(a: unknown, b: unknown, path: string, ctx: Ctx): void {
  if (a === undefined && b === undefined) return;
  if (a === undefined) return eachLeaf(b, path, (p, v) => push(ctx, { path: p, kind: "added", new: v }));
  if (b === undefined) return eachLeaf(a, path, (p, v) => push(ctx, { path: p, kind: "removed", old: v }));
  if (isLeaf(a) && isLeaf(b)) {
    const p = path || "(root)";
    if (typeof a === "number" && typeof b === "number") {
      if (numbersEqual(a, b, ctx)) ctx.unchanged[groupOf(p)] = (ctx.unchanged[groupOf(p)] ?? 0) + 1;
      else push(ctx, { path: p, kind: "changed", old: a, new: b, absoluteChange: b - a, ...(a !== 0 ? { percentChange: ((b - a) / Math.abs(a)) * 100 } : {}) });
    } else if (a === b) ctx.unchanged[groupOf(p)] = (ctx.unchanged[groupOf(p)] ?? 0) + 1;
    else push(ctx, { path: p, kind: "changed", old: a, new: b });
    return;
  }
  if (isObject(a) && isObject(b)) {
    const keys = [...Object.keys(a), ...Object.keys(b).filter((k) => !(k in a))];
    for (const k of keys) walk(a[k], b[k], join(path, k), ctx);
    return;
  }
  if (Array.isArray(a) && Array.isArray(b)) {
    if ((isStringList(a) || a.length === 0) && (isStringList(b) || b.length === 0) && a.length + b.length > 0) {
      const inA = new Set(a as string[]);
      const inB = new Set(b as string[]);
      for (const s of inA) if (!inB.has(s)) push(ctx, { path, kind: "removed", old: s });
      for (const s of inB) if (!inA.has(s)) push(ctx, { path, kind: "added", new: s });
      for (const s of inA) if (inB.has(s)) ctx.unchanged[groupOf(path)] = (ctx.unchanged[groupOf(path)] ?? 0) + 1;
      return;
    }
    const fields = chooseIdentity(a, b);
    if (fields) {
      const byIdB = new Map(b.map((item) => [identityOf(item, fields) as string, item]));
      const idsA = new Set<string>();
      for (const item of a) {
        const id = identityOf(item, fields) as string;
        idsA.add(id);
        walk(item, byIdB.get(id), `${path}[${JSON.stringify(id)}]`, ctx);
      }
      for (const [id, item] of byIdB) if (!idsA.has(id)) walk(undefined, item, `${path}[${JSON.stringify(id)}]`, ctx);
      return;
    }
    for (let i = 0; i < Math.max(a.length, b.length); i += 1) walk(a[i], b[i], `${path}[${i}]`, ctx);
    return;
  }
  // The shape itself changed (a number became an object, …): old leaves out, new in.
  walk(a, undefined, path, ctx);
  walk(undefined, b, path, ctx);
}

/** The difference between two JSON documents (inputs, results, any nesting). */
export function diffDocuments(oldDoc: unknown, newDoc: unknown, options: DiffOptions = {}): SectionDiff {
  const ctx: Ctx = { rel: options.relativeTolerance ?? 1e-9, abs: options.absoluteTolerance ?? 0, entries: [], unchanged: {} };
  walk(oldDoc, newDoc, "", ctx);
  return { entries: ctx.entries, unchanged: ctx.unchanged };
}

/** Every leaf path of a document with its value (the fields a comment can be attached to). */
export function listLeafPaths(doc: unknown): { path: string; value: LeafValue }[] {
  const out: { path: string; value: LeafValue }[] = [];
  eachLeaf(doc, "", (path, value) => out.push({ path, value }));
  return out;
}

function checkKey(c: CheckResult): string {
  return c.key ?? `${c.id}/${c.label}`;
}

/**
 * Checks in both results whose verdict differs (pass, fail, accepted with justification); newly
 * failing first, then newly accepted, then newly passing. A check present in one result only
 * (e.g. band checks against a revision computed before they existed) is no flip: it shows in the
 * result's difference as added or removed.
 */
export function flippedChecks(oldChecks: readonly CheckResult[], newChecks: readonly CheckResult[]): CheckFlip[] {
  const before = new Map(oldChecks.map((c) => [checkKey(c), c]));
  const flips: CheckFlip[] = [];
  for (const n of newChecks) {
    const o = before.get(checkKey(n));
    if (!o) continue;
    const oldVerdict = checkVerdict(o);
    const newVerdict = checkVerdict(n);
    if (oldVerdict === newVerdict) continue;
    flips.push({
      key: checkKey(n),
      label: n.label,
      source: n.source,
      ...(n.unit ? { unit: n.unit } : {}),
      oldPass: o.pass,
      newPass: n.pass,
      oldVerdict,
      newVerdict,
      ...(n.acceptance ? { justification: n.acceptance.justification } : {}),
      ...(n.soilCase ? { soilCase: n.soilCase } : {}),
      oldValue: o.value,
      newValue: n.value,
      oldLimit: o.limit,
      newLimit: n.limit,
    });
  }
  const order: Record<CheckVerdict, number> = { fail: 0, accepted: 1, pass: 2, "not-applicable": 3 };
  return flips.sort((x, y) => order[x.newVerdict] - order[y.newVerdict] || x.label.localeCompare(y.label));
}

// The frequency sweep and the envelope series of the start-up and coast-down runs are
// hundreds of numbers per curve: they are compared as plots, not line by line, and are no
// fields to list or comment on. Everything else of a run (settings, peaks, model, warnings)
// stays.
export type ResultWithoutSeries = Omit<AnalysisResult, "sweep" | "transient"> & { transient?: Omit<TransientResult, "series">[] };

/** A result as stored, or read without its sweep (the comparison route reads only what it lists). */
export type ComparableResult = Omit<AnalysisResult, "sweep"> & { sweep?: AnalysisResult["sweep"] };

export function withoutLongSeries(result: ComparableResult): ResultWithoutSeries {
  const { sweep: _sweep, transient, ...rest } = result;
  void _sweep;
  if (!transient) return rest;
  return {
    ...rest,
    transient: transient.map((run) => {
      const { series: _series, ...kept } = run;
      void _series;
      return kept;
    }),
  };
}

/** Inputs and results of two revisions compared; the older one first. */
export function diffRevisions(
  older: { input: unknown; result: ComparableResult },
  newer: { input: unknown; result: ComparableResult },
  options: DiffOptions = {},
): RevisionDiff {
  return {
    flippedChecks: flippedChecks(older.result.checks, newer.result.checks),
    input: diffDocuments(older.input, newer.input, options),
    result: diffDocuments(withoutLongSeries(older.result), withoutLongSeries(newer.result), options),
  };
}
