import { eq } from "drizzle-orm";
import { getDb } from "../client";
import { foundationDrafts, vendorRequests, vendorSubmissionReviews, vendorSubmissions } from "../schema";
import type { MachineInput } from "@/modules/calc/schema";
import { storeFile } from "./files";
import { machinesSha256 } from "./vendor-submissions";
import type { RequestedMachine } from "./vendor-requests";

export interface DemoVendorHistory {
  /** Chosen by the caller: the version-2 workbook carries it in its format marker. */
  requestId: string;
  projectId: string;
  foundationId: string;
  companyId: string;
  vendorUserId: string;
  designerUserId: string;
  /** What the desk held when the request was sent. */
  requested: RequestedMachine[];
  /** Version 1 (typed into the web form) and version 2 (a workbook upload). */
  first: MachineInput[];
  second: { machines: MachineInput[]; workbook: Buffer; fileName: string };
}

/**
 * For the demo seed only (trusted, no actor): a request answered twice, both versions
 * accepted, the draft pointing at the second. One transaction, dated in the past so the
 * history reads in order.
 */
export async function createDemoVendorHistory(h: DemoVendorHistory): Promise<{ requestId: string; submissionIds: [string, string] }> {
  const day = 24 * 60 * 60 * 1000;
  const at = (daysAgo: number) => new Date(Date.now() - daysAgo * day);
  return getDb().transaction(async (tx) => {
    const [request] = await tx
      .insert(vendorRequests)
      .values({
        id: h.requestId,
        projectId: h.projectId,
        foundationId: h.foundationId,
        companyId: h.companyId,
        contactUserId: h.vendorUserId,
        requestedById: h.designerUserId,
        message: "Please confirm masses, rotor data and bearing positions against the certified general arrangement drawings.",
        dueOn: at(10).toISOString().slice(0, 10),
        machines: h.requested,
        createdAt: at(30),
        updatedAt: at(6),
      })
      .returning();
    if (!request) throw new Error("demo request insert returned nothing");
    const [v1] = await tx
      .insert(vendorSubmissions)
      .values({ requestId: request.id, projectId: h.projectId, version: 1, source: "form", machines: h.first, sha256: machinesSha256(h.first), note: "Preliminary data from the quotation drawings.", submittedById: h.vendorUserId, createdAt: at(24), updatedAt: at(24) })
      .returning();
    if (!v1) throw new Error("demo submission insert returned nothing");
    await tx.insert(vendorSubmissionReviews).values({ submissionId: v1.id, decision: "accepted", reviewedById: h.designerUserId, createdAt: at(23), updatedAt: at(23) });
    const file = await storeFile(tx, { projectId: h.projectId, requestId: request.id, purpose: "machine-data", fileName: h.second.fileName, contentType: "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet", bytes: h.second.workbook, uploadedById: h.vendorUserId });
    const [v2] = await tx
      .insert(vendorSubmissions)
      .values({ requestId: request.id, projectId: h.projectId, version: 2, source: "workbook", machines: h.second.machines, fileId: file.id, sha256: file.sha256, note: "Certified data: impeller mass revised after the final impeller selection.", submittedById: h.vendorUserId, createdAt: at(7), updatedAt: at(7) })
      .returning();
    if (!v2) throw new Error("demo submission insert returned nothing");
    const drafts = await tx.select({ version: foundationDrafts.version }).from(foundationDrafts).where(eq(foundationDrafts.foundationId, h.foundationId));
    await tx.insert(vendorSubmissionReviews).values({ submissionId: v2.id, decision: "accepted", draftVersion: drafts[0]?.version ?? null, reviewedById: h.designerUserId, createdAt: at(6), updatedAt: at(6) });
    // The seeded draft already holds version 2's machines (examples/raw-water-pump-train.json).
    await tx.update(foundationDrafts).set({ vendorSubmissionId: v2.id }).where(eq(foundationDrafts.foundationId, h.foundationId));
    return { requestId: request.id, submissionIds: [v1.id, v2.id] };
  });
}
