// Stale approvals: an approved foundation is flagged when the vendor submission
// behind its approval is superseded by a newer version, until a new revision is issued.
import { and, asc, eq } from "drizzle-orm";
import { readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { parseAnalysisInput } from "@/modules/calc";
import { isApprovalStale } from "@/modules/revisions/status";
import { closeDb, getDb } from "@/db/client";
import { createFoundation, getProjectByCode } from "@/db/queries/projects";
import { createSeedRevision, listFoundationRevisionStates } from "@/db/queries/revisions";
import { foundations, vendorRequests, vendorSubmissions } from "@/db/schema";
import { getFixture, type Fixture } from "./support/fixture";

let fx: Fixture;
beforeAll(async () => {
  fx = await getFixture();
});
afterAll(async () => {
  await closeDb();
});

describe("stale approval flag", () => {
  it("flags an approval based on a vendor version that has a newer one, and clears with a new revision", async () => {
    const project = await getProjectByCode("WRP-PH1");
    const pump = (await getDb().select().from(foundations).where(and(eq(foundations.projectId, project!.id), eq(foundations.tag, "PH1-P101"))))[0];
    const request = (await getDb().select().from(vendorRequests).where(eq(vendorRequests.foundationId, pump!.id)))[0];
    const versions = await getDb().select().from(vendorSubmissions).where(eq(vendorSubmissions.requestId, request!.id)).orderBy(asc(vendorSubmissions.version));
    expect(versions.length).toBeGreaterThanOrEqual(2);
    const [v1, v2] = versions as [(typeof versions)[number], (typeof versions)[number]];
    const parsed = parseAnalysisInput(JSON.parse(readFileSync(path.join(process.cwd(), "examples", "raw-water-pump-train.json"), "utf8")));
    if (!parsed.ok) throw new Error("example invalid");
    const manager = { userId: fx.userIds.manager, isAdmin: false };
    const f = await createFoundation(manager, fx.projectId, { tag: `STALE-${Date.now()}`, machineTrain: "stale check", location: "" });
    const approvedOn = async (submissionId: string) =>
      createSeedRevision({
        projectId: fx.projectId,
        foundationId: f.id,
        input: parsed.input,
        issuedById: fx.userIds.designer,
        issuedAt: new Date(),
        vendorSubmissionId: submissionId,
        decision: { outcome: "approved", note: "", decidedById: fx.userIds.checker, decidedAt: new Date() },
      });
    const stateOf = async () => (await listFoundationRevisionStates(manager, fx.projectId)).find((s) => s.foundationId === f.id);

    await approvedOn(v1.id);
    const before = await stateOf();
    expect(before?.latest?.status).toBe("approved");
    expect(before?.latest?.supersededByNewerVersion).toBe(true);
    expect(isApprovalStale(before!.latest!, v1.id)).toBe(true);

    // A new revision on the newest vendor version clears the flag.
    await approvedOn(v2.id);
    const after = await stateOf();
    expect(after?.latest?.supersededByNewerVersion).toBe(false);
    expect(isApprovalStale(after!.latest!, v2.id)).toBe(false);
    // A draft that moved to another submission flags it again.
    expect(isApprovalStale(after!.latest!, v1.id)).toBe(true);
  });
});
