// Concurrency: two designers saving one draft from the same version, racing approvals of
// one revision, and a vendor submitting a new version while the designer takes the
// previous one into the draft. Every round ends with exactly one winner, every loser is
// told (409 / conflict), and the stored state is the winner's: no lost update, no duplicate.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, getPool } from "@/db/client";
import { createUser } from "@/db/queries/accounts";
import { getDraft } from "@/db/queries/drafts";
import { upsertMember } from "@/db/queries/projects";
import { acceptSubmissionAction, submitMachineFormAction } from "@/app/(desk)/projects/[projectId]/requests/actions";
import { callAction, cookieFor, getFixture, type Fixture } from "../support/fixture";
import { callRouteAt, Tally } from "../support/hardening-helpers";
import { createHardeningProject, type HardeningProject } from "../support/hardening-project";
import { sampleAnalysisInput } from "../analysis-input-sample";

const DRAFT = "v1/projects/[projectId]/foundations/[foundationId]/draft";

let fx: Fixture;
let hx: HardeningProject;
const designers: string[] = [];
const checkers: string[] = [];
const figures: string[] = [];

async function memberCookie(projectId: string, role: "designer" | "checker", n: number): Promise<string> {
  const u = await createUser({ email: `hx-cc-${role}-${n}-${Date.now()}@example.test`, name: `Concurrent ${role} ${n}` });
  await upsertMember({ projectId, userId: u.id, role });
  return cookieFor(u.id);
}

beforeAll(async () => {
  fx = await getFixture();
  hx = await createHardeningProject({ userId: fx.userIds.manager, isAdmin: false }, "CC");
  for (const n of [1, 2]) designers.push(await memberCookie(hx.projectId, "designer", n));
  for (const n of [1, 2]) checkers.push(await memberCookie(hx.projectId, "checker", n));
});

afterAll(async () => {
  console.log(`[hardening] concurrency figures:\n  ${figures.join("\n  ")}`);
  await closeDb();
});

describe("two designers save the same draft from the same version", () => {
  it("exactly one save wins each round, the other gets 409 with the winner's draft, and the store holds the winner's input", async () => {
    const params = { projectId: hx.projectId, foundationId: hx.foundationId };
    const tally = new Tally();
    const rounds = 12;
    for (let round = 0; round < rounds; round++) {
      const { draft } = (await (await callRouteAt(DRAFT, "GET", params, { cookie: designers[0] })).json()) as { draft: { version: number } };
      const inputs = [0, 1].map((i) => {
        const input = sampleAnalysisInput();
        input.soil.shearModulus = 5.0e7 + round * 1e6 + i * 1e5;
        return input;
      });
      const results = await Promise.all(inputs.map((input, i) => callRouteAt(DRAFT, "PUT", params, { cookie: designers[i], body: { version: draft.version, input } })));
      const statuses = results.map((r) => r.status);
      for (const s of statuses) tally.add(s);
      expect([...statuses].sort()).toEqual([200, 409]);
      const winnerAt = statuses.indexOf(200);
      const winner = (await results[winnerAt]!.json()) as { draft: { version: number; input: { soil: { shearModulus: number } } } };
      const loser = (await results[1 - winnerAt]!.json()) as { error: { code: string; currentVersion: number }; current: { version: number; input: { soil: { shearModulus: number } } } };
      expect(loser.error).toMatchObject({ code: "conflict", currentVersion: draft.version + 1 });
      expect(loser.current.input.soil.shearModulus).toBe(inputs[winnerAt]!.soil.shearModulus);
      const stored = await getDraft({ userId: fx.userIds.manager, isAdmin: false }, hx.projectId, hx.foundationId);
      expect(stored?.version).toBe(draft.version + 1);
      expect(winner.draft.version).toBe(draft.version + 1);
      expect(stored?.input?.soil.shearModulus).toBe(inputs[winnerAt]!.soil.shearModulus);
    }
    figures.push(`draft saves: ${rounds} rounds of 2, statuses ${tally}`);
  });
});

describe("racing decisions on one revision", () => {
  it("lets exactly one of four decisions (two checkers approving twice each, one returning) through", async () => {
    const tally = new Tally();
    // A fresh revision: the draft changed above, so issuing it is allowed.
    const issued = await callRouteAt("v1/projects/[projectId]/foundations/[foundationId]/revisions", "POST", { projectId: hx.projectId, foundationId: hx.foundationId }, { cookie: designers[0], body: { note: "First issue." } });
    expect(issued.status).toBe(201);
    const { revision } = (await issued.json()) as { revision: { id: string } };
    const params = { projectId: hx.projectId, foundationId: hx.foundationId, revisionId: revision.id };
    const bodies = [
      { cookie: checkers[0], body: { outcome: "approved", note: "" } },
      { cookie: checkers[1], body: { outcome: "approved", note: "" } },
      { cookie: checkers[0], body: { outcome: "approved", note: "" } },
      { cookie: checkers[1], body: { outcome: "returned", note: "race" } },
    ];
    const results = await Promise.all(bodies.map((b) => callRouteAt("v1/projects/[projectId]/foundations/[foundationId]/revisions/[revisionId]/decision", "POST", params, b)));
    for (const r of results) tally.add(r.status);
    expect(results.map((r) => r.status).sort()).toEqual([201, 409, 409, 409]);
    const rows = await getPool().query<{ n: number }>("SELECT count(*)::int AS n FROM revision_decisions WHERE revision_id = $1", [revision.id]);
    expect(rows.rows[0]?.n).toBe(1);
    figures.push(`decisions: 4 racing on one revision, statuses ${tally}`);
  });
});

describe("a vendor submits a new version while the designer accepts the previous one", () => {
  it("either the accept lands before the new version or it is refused as superseded; versions stay 1..n without gaps or twins", async () => {
    const machines = JSON.stringify(sampleAnalysisInput().machines);
    const outcomes = new Tally();
    const rounds = 8;
    for (let round = 0; round < rounds; round++) {
      // The version the designer looks at: the newest one, not yet reviewed.
      const made = await callAction(submitMachineFormAction, { projectId: hx.projectId, requestId: hx.requestId, machines, note: `round ${round}` }, hx.vendorCookie);
      expect(made.state.ok, JSON.stringify(made.state)).toBe(true);
      if (!made.state.ok) return;
      const seen = { id: String(made.state.data.submissionId), version: Number(made.state.data.version) };
      const before = await getDraft({ userId: fx.userIds.manager, isAdmin: false }, hx.projectId, hx.foundationId);
      // Even rounds start both at once; odd rounds give the vendor a few milliseconds' lead,
      // so both orders of the race are seen.
      const lead = round % 2 ? 5 + round : 0;
      const [submit, accept] = await Promise.all([
        callAction(submitMachineFormAction, { projectId: hx.projectId, requestId: hx.requestId, machines, note: `round ${round} newer` }, hx.vendorCookie),
        new Promise((r) => setTimeout(r, lead)).then(() =>
          callAction(acceptSubmissionAction, { projectId: hx.projectId, submissionId: seen.id, draftVersion: String(before?.version) }, fx.cookies.manager),
        ),
      ]);
      // The vendor's version is never lost.
      expect(submit.state.ok, JSON.stringify(submit.state)).toBe(true);
      if (submit.state.ok) expect(Number(submit.state.data.version)).toBe(seen.version + 1);
      const after = await getDraft({ userId: fx.userIds.manager, isAdmin: false }, hx.projectId, hx.foundationId);
      const reviews = await getPool().query<{ submission_id: string; draft_version: number | null }>(
        "SELECT r.submission_id, r.draft_version FROM vendor_submission_reviews r JOIN vendor_submissions s ON s.id = r.submission_id WHERE s.request_id = $1 AND s.version >= $2",
        [hx.requestId, seen.version],
      );
      if (accept.state.ok) {
        outcomes.add("accepted-first");
        expect(after?.version).toBe((before?.version ?? 0) + 1);
        expect(after?.vendorSubmissionId).toBe(seen.id);
        expect(reviews.rows).toEqual([{ submission_id: seen.id, draft_version: after?.version }]);
      } else {
        outcomes.add(`refused:${accept.state.code}`);
        expect(accept.state.code).toBe("conflict");
        expect(accept.state.message).toMatch(/superseded by version/);
        expect(after?.version).toBe(before?.version);
        expect(after?.vendorSubmissionId).toBe(before?.vendorSubmissionId);
        expect(reviews.rows).toEqual([]);
      }
    }
    const versions = await getPool().query<{ version: number }>("SELECT version FROM vendor_submissions WHERE request_id = $1 ORDER BY version", [hx.requestId]);
    const list = versions.rows.map((r) => r.version);
    expect(list).toEqual(Array.from({ length: list.length }, (_, i) => i + 1));
    expect(list.length).toBe(1 + rounds * 2);
    figures.push(`vendor submit vs accept: ${rounds} rounds, outcomes ${outcomes}; versions 1..${list.length} without gaps or twins`);
  });
});
