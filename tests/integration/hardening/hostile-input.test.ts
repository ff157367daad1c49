// Hostile input: property-based fuzzing (fast-check) of the JSON routes that take a body
// and of every server action, with wrong types, huge arrays, deep nesting, NaN and
// Infinity (as JSON-breaking literals, as 1e999, as strings), __proto__ keys and 10 MB
// strings. Every answer must be a clean one (2xx, 400, 409, 413, 401/403/404, 429),
// never a 500 or the "internal" code; afterwards no stored draft or revision holds a
// number that is not finite, and Object.prototype is untouched.
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db/client";
import { createUser } from "@/db/queries/accounts";
import { getDraft } from "@/db/queries/drafts";
import { hashPassword } from "@/app/_lib/passwords";
import { portFromRequest, runWithRequest } from "@/app/_lib/request-context";
import { acceptInvitationAction, forgotPasswordAction, resetPasswordAction, signInAction, signOutAction } from "@/app/(auth)/actions";
import {
  createFoundationAction,
  restoreFoundationAction,
  withdrawFoundationAction,
  createProjectAction,
  inviteMemberAction,
  removeMemberAction,
  setUnitsPreferenceAction,
  updateProjectSettingsAction,
} from "@/app/(desk)/actions";
import { commentOnRevisionAction, decideRevisionAction, issueRevisionAction, resolveRevisionCommentAction, shareRevisionAction } from "@/app/(desk)/projects/[projectId]/foundations/[foundationId]/revisions/actions";
import { acceptSubmissionAction, returnSubmissionAction, sendDataRequestAction, submitMachineFormAction } from "@/app/(desk)/projects/[projectId]/requests/actions";
import { cookieFor, freshPeer, getFixture, makeRequest, type ActionFn, type Fixture } from "../support/fixture";
import { callRouteAt, errorOf, scanStoredNumbers, Tally } from "../support/hardening-helpers";
import { createHardeningProject, type HardeningProject } from "../support/hardening-project";
import { sampleAnalysisInput } from "../analysis-input-sample";

// ---- hostile JSON values -------------------------------------------------------------

/** A token written into the JSON text as is (NaN and Infinity are not JSON; 1e999 parses to Infinity). */
class Raw {
  constructor(readonly text: string) {}
}
const RAW = (s: string) => `@@RAW@@${s}@@`;

/** JSON text of a value, with Raw tokens and non-finite numbers written as bare literals. */
function hostileJson(value: unknown): string {
  const text = JSON.stringify(value, (_k, v: unknown) => {
    if (v instanceof Raw) return RAW(v.text);
    if (typeof v === "number" && !Number.isFinite(v)) return RAW(Number.isNaN(v) ? "NaN" : v > 0 ? "Infinity" : "-Infinity");
    return v;
  });
  return text.replace(/"@@RAW@@(.*?)@@"/g, "$1");
}

function nested(depth: number): unknown {
  let v: unknown = 1;
  for (let i = 0; i < depth; i++) v = i % 2 ? [v] : { a: v };
  return v;
}

function protoObject(): Record<string, unknown> {
  return JSON.parse('{"__proto__":{"polluted":"yes","isAdmin":true},"constructor":{"prototype":{"polluted":"yes"}}}') as Record<string, unknown>;
}

const TEN_MB = "x".repeat(10 * 1024 * 1024);

const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 4, arbitrary: fc.constantFrom<unknown>(new Raw("NaN"), new Raw("Infinity"), new Raw("-Infinity"), new Raw("1e999"), new Raw("-1e999"), "NaN", "Infinity", "-Infinity", "1e999", null, true, "", "__proto__", [], {}, -0, 1e308, -1e308, 5e-324, 2 ** 60) },
  { weight: 3, arbitrary: fc.double() },
  { weight: 1, arbitrary: fc.integer({ min: -(2 ** 31), max: 2 ** 31 }) },
  { weight: 2, arbitrary: fc.string({ maxLength: 40 }) },
  { weight: 1, arbitrary: fc.array(fc.double(), { maxLength: 6 }) },
  { weight: 1, arbitrary: fc.integer({ min: 50, max: 800 }).map(nested) },
  { weight: 1, arbitrary: fc.integer({ min: 1000, max: 40_000 }).map((n) => Array.from({ length: n }, () => ({ name: "box", x: [0, 1], y: [0, 1], z: [0, 1] }))) },
  { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 3 }) },
  { weight: 1, arbitrary: fc.constant(null).map(protoObject) },
);

type Path = (string | number)[];

function leafPaths(v: unknown, path: Path = [], out: Path[] = []): Path[] {
  out.push(path);
  if (Array.isArray(v)) v.forEach((x, i) => leafPaths(x, [...path, i], out));
  else if (v && typeof v === "object") for (const [k, x] of Object.entries(v)) leafPaths(x, [...path, k], out);
  return out;
}

function setAt(root: unknown, path: Path, value: unknown): unknown {
  if (path.length === 0) return value;
  let cur = root as Record<string | number, unknown>;
  for (const p of path.slice(0, -1)) cur = cur[p] as Record<string | number, unknown>;
  const last = path[path.length - 1]!;
  // defineProperty, so a key "__proto__" becomes an own property as JSON.parse would make it.
  Object.defineProperty(cur, last, { value, enumerable: true, writable: true, configurable: true });
  return root;
}

/** A valid document with one to three places replaced by hostile values, sometimes an extra hostile key. */
function mutated(base: () => unknown): fc.Arbitrary<unknown> {
  const paths = leafPaths(base());
  return fc
    .record({
      edits: fc.array(fc.tuple(fc.integer({ min: 0, max: paths.length - 1 }), hostileValue), { minLength: 1, maxLength: 3 }),
      extra: fc.option(fc.tuple(fc.constantFrom("__proto__", "constructor", "prototype", "colour", "$where"), hostileValue), { freq: 3 }),
    })
    .map(({ edits, extra }) => {
      let doc = base();
      for (const [i, v] of edits) {
        const p = paths[i];
        // Only paths that still exist after earlier edits.
        try {
          if (p) doc = setAt(doc, p, v);
        } catch {
          /* an earlier edit removed the parent */
        }
      }
      if (extra && doc && typeof doc === "object") setAt(doc, [extra[0]], extra[1]);
      return doc;
    });
}

function getAt(root: unknown, path: Path): unknown {
  let cur = root;
  for (const p of path) cur = (cur as Record<string | number, unknown>)[p];
  return cur;
}

/**
 * A valid document whose numbers are scaled to extremes (still finite, often still valid):
 * the inputs that get through validation and reach the engine and the database.
 */
function scaled(base: () => unknown): fc.Arbitrary<unknown> {
  const doc0 = base();
  const numeric = leafPaths(doc0).filter((p) => typeof getAt(doc0, p) === "number");
  if (numeric.length === 0) return fc.constant(null).map(() => base());
  const factor = fc.oneof(fc.constantFrom(0, -1, 1e-300, 1e-12, 1e-6, 0.5, 0.999, 1.001, 2, 1e6, 1e12, 1e150, 1e300), fc.double({ min: -1e6, max: 1e6, noNaN: true }));
  return fc.array(fc.tuple(fc.integer({ min: 0, max: numeric.length - 1 }), factor), { minLength: 1, maxLength: 2 }).map((edits) => {
    const doc = base();
    for (const [i, f] of edits) {
      const p = numeric[i];
      if (p) setAt(doc, p, (getAt(doc, p) as number) * f);
    }
    return doc;
  });
}

/** A body: mostly mutated valid documents, sometimes anything at all, broken JSON or deep nesting. */
function bodyOf(base: () => unknown): fc.Arbitrary<string> {
  return fc.oneof(
    { weight: 4, arbitrary: mutated(base).map(hostileJson) },
    { weight: 3, arbitrary: scaled(base).map(hostileJson) },
    { weight: 1, arbitrary: hostileValue.map(hostileJson) },
    { weight: 1, arbitrary: fc.string({ maxLength: 60 }) },
    { weight: 1, arbitrary: mutated(base).map((d) => hostileJson(d).slice(0, -3)) },
    { weight: 1, arbitrary: fc.integer({ min: 1000, max: 50_000 }).map((n) => "[".repeat(n) + "]".repeat(n)) },
  );
}

// ---- the fixture ---------------------------------------------------------------------

let fx: Fixture;
let hx: HardeningProject;
let fuzzEmail: string;
const fuzzPassword = "hardening-fuzz-password";
const figures: string[] = [];

beforeAll(async () => {
  fx = await getFixture();
  // A project of our own (the demo manager manages it), so fuzzed settings and drafts never touch the demo.
  hx = await createHardeningProject({ userId: fx.userIds.manager, isAdmin: false }, "FZ");
  fuzzEmail = `hx-fuzz-${Date.now()}@example.test`;
  await createUser({ email: fuzzEmail, name: "Fuzz User", passwordHash: await hashPassword(fuzzPassword) });
});

afterAll(async () => {
  console.log(`[hardening] hostile input figures:\n  ${figures.join("\n  ")}`);
  await closeDb();
});

/** Checks one route answer: an allowed status, and a JSON error (never "internal") for a refusal. */
async function expectClean(res: Response, allowed: number[], tally: Tally, what: string): Promise<void> {
  tally.add(res.status);
  if (res.status >= 400) {
    const err = await errorOf(res.clone());
    expect(err, `${what}: ${res.status} without a JSON error`).not.toBeNull();
    expect(err?.code, `${what}: ${res.status} ${err?.message}`).not.toBe("internal");
  }
  expect(allowed, `${what}: unexpected status ${res.status} ${res.status >= 400 ? (await res.text()).slice(0, 300) : ""}`).toContain(res.status);
}

// Bounded runs: the whole file stays under a minute on two cores.
const runs = { numRuns: 80, endOnFailure: true } as const;

describe("route handlers under hostile bodies", () => {
  it("POST /api/v1/calculate answers 200, 400 or 413, never 500", async () => {
    const tally = new Tally();
    await fc.assert(
      fc.asyncProperty(bodyOf(sampleAnalysisInput), async (body) => {
        const res = await callRouteAt("v1/calculate", "POST", {}, { cookie: fx.cookies.designer, body });
        await expectClean(res, [200, 400, 413], tally, `calculate ${body.slice(0, 120)}`);
      }),
      runs,
    );
    const big = await callRouteAt("v1/calculate", "POST", {}, { cookie: fx.cookies.designer, body: JSON.stringify({ schemaVersion: 1, note: TEN_MB }) });
    await expectClean(big, [413], tally, "calculate 10 MB");
    figures.push(`POST /api/v1/calculate: ${tally.total} cases, statuses ${tally}`);
    expect(tally.keys()).toEqual(expect.arrayContaining(["400", "413"]));
  }, 90_000);

  it("POST /api/v1/sizing answers 200, 400 or 413, never 500", async () => {
    const tally = new Tally();
    // A short search (a handful of analyses), so 80 cases stay within the file's minute.
    const envelope = () => ({
      input: sampleAnalysisInput(),
      options: { dimensions: { length: { min: 6, max: 6.4, step: 0.1 }, width: { min: 4, max: 4.4, step: 0.2 }, thickness: { min: 1.4, max: 1.6, step: 0.1 } }, centre: "load", requireSoilBand: true, maxAnalyses: 4, proposals: 2 },
    });
    const valid = await callRouteAt("v1/sizing", "POST", {}, { cookie: fx.cookies.designer, body: JSON.stringify(envelope()) });
    await expectClean(valid, [200], tally, "sizing, the untouched envelope");
    await fc.assert(
      fc.asyncProperty(bodyOf(envelope), async (body) => {
        const res = await callRouteAt("v1/sizing", "POST", {}, { cookie: fx.cookies.designer, body });
        await expectClean(res, [200, 400, 413], tally, `sizing ${body.slice(0, 120)}`);
      }),
      runs,
    );
    const big = await callRouteAt("v1/sizing", "POST", {}, { cookie: fx.cookies.designer, body: JSON.stringify({ input: { schemaVersion: 1, note: TEN_MB }, options: {} }) });
    await expectClean(big, [413], tally, "sizing 10 MB");
    figures.push(`POST /api/v1/sizing: ${tally.total} cases, statuses ${tally}`);
    expect(tally.keys()).toEqual(expect.arrayContaining(["200", "400", "413"]));
  }, 120_000);

  it("PUT .../draft answers 200, 400, 409 or 413, and what it saves is a finite, valid input", async () => {
    const tally = new Tally();
    const params = { projectId: hx.projectId, foundationId: hx.foundationId };
    const actor = { userId: fx.userIds.manager, isAdmin: false };
    const envelope = () => ({ version: 1, input: sampleAnalysisInput() });
    await fc.assert(
      fc.asyncProperty(bodyOf(envelope), fc.boolean(), async (raw, useCurrent) => {
        const current = (await getDraft(actor, hx.projectId, hx.foundationId))?.version ?? 0;
        // Half the cases start from the stored version, so valid-looking saves really land.
        const body = useCurrent ? raw.replace(/^\{"version":1,/, `{"version":${current},`) : raw;
        const res = await callRouteAt("v1/projects/[projectId]/foundations/[foundationId]/draft", "PUT", params, { cookie: fx.cookies.manager, body });
        await expectClean(res, [200, 400, 409, 413], tally, `draft ${body.slice(0, 120)}`);
      }),
      runs,
    );
    const big = await callRouteAt("v1/projects/[projectId]/foundations/[foundationId]/draft", "PUT", params, { cookie: fx.cookies.manager, body: JSON.stringify({ version: 1, input: TEN_MB }) });
    await expectClean(big, [413], tally, "draft 10 MB");
    figures.push(`PUT .../draft: ${tally.total} cases, statuses ${tally}`);
    expect(tally.keys()).toEqual(expect.arrayContaining(["200", "400"]));
  }, 90_000);

  it("POST .../foundations answers 201, 400, 409 or 413", async () => {
    const tally = new Tally();
    const base = () => ({ tag: "HX-FZ-T", machineTrain: "Fuzz fan", location: "Bay" });
    await fc.assert(
      fc.asyncProperty(bodyOf(base), async (body) => {
        const res = await callRouteAt("v1/projects/[projectId]/foundations", "POST", { projectId: hx.projectId }, { cookie: fx.cookies.manager, body });
        await expectClean(res, [201, 400, 409, 413], tally, `foundations ${body.slice(0, 120)}`);
      }),
      runs,
    );
    figures.push(`POST .../foundations: ${tally.total} cases, statuses ${tally}`);
    expect(tally.keys()).toContain("400");
  }, 60_000);

  it("PATCH /api/v1/projects/[projectId] answers 200, 400 or 413", async () => {
    const tally = new Tally();
    const base = () => ({ units: "si", revisionScheme: "letters", criteriaDefaults: { frequencySeparation: 0.2, minMassRatio: 3 }, soilBand: { lowerFactor: 0.67, upperFactor: 1.5 } });
    await fc.assert(
      fc.asyncProperty(bodyOf(base), async (body) => {
        const res = await callRouteAt("v1/projects/[projectId]", "PATCH", { projectId: hx.projectId }, { cookie: fx.cookies.manager, body });
        await expectClean(res, [200, 400, 413], tally, `project ${body.slice(0, 120)}`);
      }),
      runs,
    );
    figures.push(`PATCH /api/v1/projects/[projectId]: ${tally.total} cases, statuses ${tally}`);
    expect(tally.keys()).toContain("400");
  }, 60_000);

  it("POST /api/v1/session answers 200, 400, 401, 413 or 429", async () => {
    const tally = new Tally();
    const base = () => ({ email: fuzzEmail, password: fuzzPassword });
    await fc.assert(
      fc.asyncProperty(bodyOf(base), async (body) => {
        // Each case from its own address, so the fuzz never throttles the address other tests use.
        const headers = freshPeer();
        const res = await callRouteAt("v1/session", "POST", {}, { body, headers });
        await expectClean(res, [200, 400, 401, 413, 429], tally, `session ${body.slice(0, 120)}`);
      }),
      { ...runs, numRuns: 60 },
    );
    figures.push(`POST /api/v1/session: ${tally.total} cases, statuses ${tally}`);
    expect(tally.keys()).toContain("400");
  }, 60_000);
});

// ---- server actions ---------------------------------------------------------------

const hostileField: fc.Arbitrary<string> = fc.oneof(
  { weight: 4, arbitrary: fc.constantFrom("", " ", "NaN", "Infinity", "-Infinity", "1e999", "-0", "0x10", "null", "undefined", "[]", "{}", "true", "__proto__", "constructor", "\u0000", "' OR 1=1 --", '{"__proto__":{"polluted":"yes"}}', "<script>alert(1)</script>", "00000000-0000-0000-0000-000000000000") },
  { weight: 2, arbitrary: fc.string({ maxLength: 60 }) },
  { weight: 1, arbitrary: fc.uuid() },
  { weight: 1, arbitrary: fc.double().map(String) },
  { weight: 1, arbitrary: fc.integer({ min: 1000, max: 300_000 }).map((n) => "y".repeat(n)) },
  { weight: 1, arbitrary: fc.constant(TEN_MB) },
);

type FieldEdit = { kind: "set"; key: string; value: string } | { kind: "drop"; key: string } | { kind: "repeat"; key: string; value: string } | { kind: "extra"; key: string; value: string };

function fieldEdits(keys: string[]): fc.Arbitrary<FieldEdit[]> {
  const key = fc.constantFrom(...keys);
  return fc.array(
    fc.oneof(
      { weight: 5, arbitrary: fc.record({ kind: fc.constant("set" as const), key, value: hostileField }) },
      { weight: 1, arbitrary: fc.record({ kind: fc.constant("drop" as const), key }) },
      { weight: 1, arbitrary: fc.record({ kind: fc.constant("repeat" as const), key, value: hostileField }) },
      { weight: 1, arbitrary: fc.record({ kind: fc.constantFrom("extra" as const), key: fc.constantFrom("__proto__", "constructor", "$ACTION_ID_x", "isAdmin", "role"), value: hostileField }) },
    ),
    { minLength: 1, maxLength: 4 },
  );
}

/** Runs an action with FormData built from the base fields and the edits (repeats become several values). */
async function runAction(action: ActionFn, base: Record<string, string>, edits: FieldEdit[], cookie: string | null, headers?: Record<string, string>) {
  const entries: [string, string][] = Object.entries(base);
  for (const e of edits) {
    if (e.kind === "drop") for (let i = entries.length - 1; i >= 0; i--) if (entries[i]?.[0] === e.key) entries.splice(i, 1);
    if (e.kind === "set") {
      const at = entries.findIndex(([k]) => k === e.key);
      if (at >= 0) entries[at] = [e.key, e.value];
      else entries.push([e.key, e.value]);
    }
    if (e.kind === "repeat" || e.kind === "extra") entries.push([e.key, e.value]);
  }
  // callAction takes a record; repeated keys need a FormData of our own.
  const fd = new FormData();
  for (const [k, v] of entries) fd.append(k, v);
  const port = portFromRequest(makeRequest("POST", "/", { cookie, headers }));
  return (await runWithRequest(port, () => action(null, fd))) as { ok: boolean; code?: string; message?: string };
}

interface ActionFuzz {
  name: string;
  action: ActionFn;
  base: () => Promise<Record<string, string>>;
  cookie: () => Promise<string | null>;
  headers?: () => Record<string, string>;
}

const cleanCodes = ["invalid_input", "unauthenticated", "forbidden", "not_found", "conflict", "too_many_requests", "payload_too_large"];

describe("every server action under hostile form fields", () => {
  const cases: ActionFuzz[] = [
    { name: "auth.signIn", action: signInAction, base: async () => ({ email: fuzzEmail, password: fuzzPassword, next: "/" }), cookie: async () => null, headers: () => freshPeer() },
    { name: "auth.forgotPassword", action: forgotPasswordAction, base: async () => ({ email: fuzzEmail }), cookie: async () => null, headers: () => freshPeer() },
    { name: "auth.resetPassword", action: resetPasswordAction, base: async () => ({ token: "not-a-real-token-xxxxxxxx", password: "a-long-password-1", confirm: "a-long-password-1" }), cookie: async () => null },
    { name: "auth.acceptInvitation", action: acceptInvitationAction, base: async () => ({ token: "not-a-real-token-xxxxxxxx", name: "X", password: "a-long-password-1", confirm: "a-long-password-1" }), cookie: async () => null },
    { name: "auth.signOut", action: signOutAction, base: async () => ({}), cookie: async () => cookieFor((await getFixture()).userIds.outsider) },
    { name: "project.create", action: createProjectAction, base: async () => ({ code: `HXP-${Date.now().toString(36)}`, name: "Fuzz project", client: "", site: "", units: "si" }), cookie: async () => fx.cookies.admin },
    { name: "members.invite", action: inviteMemberAction, base: async () => ({ projectId: hx.projectId, email: `hx-inv-${Date.now()}@example.test`, name: "Fuzz Invitee", role: "viewer", company: "" }), cookie: async () => fx.cookies.manager },
    { name: "members.remove", action: removeMemberAction, base: async () => ({ projectId: hx.projectId, memberId: "00000000-0000-4000-8000-000000000000" }), cookie: async () => fx.cookies.manager },
    { name: "account.setUnits", action: setUnitsPreferenceAction, base: async () => ({ units: "si" }), cookie: async () => fx.cookies.outsider },
    { name: "project.updateSettings", action: updateProjectSettingsAction, base: async () => ({ projectId: hx.projectId, units: "si", revisionScheme: "letters", frequencySeparation: "0.2", minMassRatio: "3" }), cookie: async () => fx.cookies.manager },
    { name: "foundation.create", action: createFoundationAction, base: async () => ({ projectId: hx.projectId, tag: `HXA-${Date.now().toString(36)}`, machineTrain: "Fuzz pump", location: "" }), cookie: async () => fx.cookies.manager },
    // A foundation id that exists nowhere: the fuzzing must not withdraw the foundation the other cases use.
    { name: "foundation.withdraw", action: withdrawFoundationAction, base: async () => ({ projectId: hx.projectId, foundationId: "00000000-0000-4000-8000-000000000000", reason: "fuzz: created twice" }), cookie: async () => fx.cookies.manager },
    { name: "foundation.restore", action: restoreFoundationAction, base: async () => ({ projectId: hx.projectId, foundationId: "00000000-0000-4000-8000-000000000000" }), cookie: async () => fx.cookies.manager },
    { name: "revision.issue", action: issueRevisionAction, base: async () => ({ projectId: hx.projectId, foundationId: hx.foundationId, note: "fuzz issue" }), cookie: async () => fx.cookies.manager },
    { name: "revision.decide", action: decideRevisionAction, base: async () => ({ projectId: hx.projectId, foundationId: hx.foundationId, revisionId: hx.revisionId, outcome: "returned", note: "fuzz" }), cookie: async () => hx.checkerCookie },
    { name: "revision.comment", action: commentOnRevisionAction, base: async () => ({ projectId: hx.projectId, foundationId: hx.foundationId, revisionId: hx.revisionId, body: "fuzz comment", fieldPath: "soil.poissonRatio" }), cookie: async () => hx.checkerCookie },
    { name: "revision.resolveComment", action: resolveRevisionCommentAction, base: async () => ({ projectId: hx.projectId, foundationId: hx.foundationId, commentId: hx.commentId, resolved: "true" }), cookie: async () => hx.checkerCookie },
    { name: "revision.share", action: shareRevisionAction, base: async () => ({ projectId: hx.projectId, foundationId: hx.foundationId, revisionId: hx.revisionId, shared: "true" }), cookie: async () => fx.cookies.manager },
    { name: "vendor.sendRequest", action: sendDataRequestAction, base: async () => ({ projectId: hx.projectId, foundationId: hx.foundationId, contact: `member:${hx.vendorId}`, machineNames: "Fan", message: "", dueOn: "" }), cookie: async () => fx.cookies.manager },
    { name: "vendor.submitForm", action: submitMachineFormAction, base: async () => ({ projectId: hx.projectId, requestId: hx.requestId, machines: JSON.stringify(sampleAnalysisInput().machines), note: "" }), cookie: async () => hx.vendorCookie },
    { name: "vendor.acceptSubmission", action: acceptSubmissionAction, base: async () => ({ projectId: hx.projectId, submissionId: hx.submissionId, draftVersion: "1" }), cookie: async () => fx.cookies.manager },
    { name: "vendor.returnSubmission", action: returnSubmissionAction, base: async () => ({ projectId: hx.projectId, submissionId: hx.submissionId, comment: "fuzz: please check" }), cookie: async () => fx.cookies.manager },
  ];

  it("covers every action the registry knows", async () => {
    const { actionRegistry } = await import("@/app/_lib/action");
    const missing = [...actionRegistry.keys()].filter((n) => !cases.some((c) => c.name === n));
    expect(missing, `actions without a fuzz case: ${missing.join(", ")}`).toEqual([]);
  });

  it.each(cases.map((c) => [c.name, c] as const))("%s never answers internal", async (_name, c) => {
    const tally = new Tally();
    const keys = Object.keys(await c.base());
    await fc.assert(
      fc.asyncProperty(fieldEdits(keys.length ? keys : ["x"]), async (edits) => {
        const state = await runAction(c.action, await c.base(), edits, await c.cookie(), c.headers?.());
        tally.add(state.ok ? "ok" : (state.code ?? "?"));
        expect(state.ok || cleanCodes.includes(state.code ?? ""), `${c.name} ${JSON.stringify(edits).slice(0, 300)} -> ${JSON.stringify(state).slice(0, 300)}`).toBe(true);
      }),
      { numRuns: 30, endOnFailure: true },
    );
    figures.push(`action ${c.name}: ${tally.total} cases, ${tally}`);
    expect(tally.total).toBe(30);
  }, 60_000);
});

describe("after the fuzz", () => {
  it("no stored draft or revision holds NaN, Infinity or a null number, and Object.prototype is clean", async () => {
    const scan = await scanStoredNumbers();
    figures.push(`stored JSON scanned: ${scan.drafts} drafts, ${scan.revisions} revisions, ${scan.bad.length} non-finite values`);
    expect(scan.bad).toEqual([]);
    expect(scan.drafts).toBeGreaterThan(0);
    const probe = {} as Record<string, unknown>;
    expect(probe.polluted).toBeUndefined();
    expect(probe.isAdmin).toBeUndefined();
  });
});
