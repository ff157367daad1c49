// A project of the hardening tests' own, with one of everything a project holds: a
// foundation with a saved draft, an issued revision with a comment, a vendor of its own
// company with a data request, a submitted version and a drawing. Built through the same
// query and service functions the routes use, so the demo project is left as seeded.
import { createUser } from "@/db/queries/accounts";
import { saveDraft } from "@/db/queries/drafts";
import { createFoundation, createProject, getOrCreateCompany, listMembers, upsertMember, type Actor } from "@/db/queries/projects";
import { createRevisionComment, issueRevision } from "@/db/queries/revisions";
import { createRequestDrawing } from "@/db/queries/vendor-submissions";
import { parseAnalysisInput } from "@/modules/calc";
import { validateMachines } from "@/modules/vendor-data/validate";
import { sendDataRequest, submitMachineData } from "@/app/(desk)/projects/[projectId]/requests/vendor-service";
import { sampleAnalysisInput } from "../analysis-input-sample";
import { cookieFor } from "./fixture";
import { onePagePdf } from "../../support/pdf-fixture";

export interface HardeningProject {
  projectId: string;
  code: string;
  foundationId: string;
  foundationTag: string;
  revisionId: string;
  commentId: string;
  requestId: string;
  submissionId: string;
  fileId: string;
  /** The owner's own membership row. */
  memberId: string;
  vendorId: string;
  vendorCookie: string;
  checkerId: string;
  checkerCookie: string;
}

let seq = 0;

export async function createHardeningProject(owner: Actor, label: string): Promise<HardeningProject> {
  seq += 1;
  const stamp = `${Date.now().toString(36)}${seq}`;
  const code = `HX-${label}-${stamp}`.slice(0, 24);
  const project = await createProject(owner, { code, name: `Hardening ${label}`, client: "", site: "", units: "si" });
  const foundationTag = `HX-${label}-F1`;
  const foundation = await createFoundation(owner, project.id, { tag: foundationTag, machineTrain: "Hardening fan", location: "Bay H" });
  const parsed = parseAnalysisInput(sampleAnalysisInput());
  if (!parsed.ok) throw new Error("the sample input is not valid");
  // Each machine's datum placed at the block's origin, unturned: the web form gives positions
  // from the machine datum, and they read the same on the block here.
  const placements = parsed.input.machines.map((m) => ({ machine: m.name, datum: { origin: [0, 0, 0] as [number, number, number], rotationDeg: 0 as const }, vendor: null }));
  const saved = await saveDraft(owner, project.id, foundation.id, { input: parsed.input, expectedVersion: 0, placements });
  if (!saved?.ok) throw new Error("hardening draft not saved");
  const issued = await issueRevision(owner, project.id, foundation.id);
  if (!issued.ok) throw new Error(`hardening revision not issued: ${issued.reason}`);

  const checker = await createUser({ email: `hx-checker-${stamp}@example.test`, name: "Hal Checker" });
  await upsertMember({ projectId: project.id, userId: checker.id, role: "checker" });
  const checkerActor = { userId: checker.id, isAdmin: false };
  const comment = await createRevisionComment(checkerActor, project.id, foundation.id, issued.revision.id, { body: `hardening ${label}`, fieldPath: null, parentId: null });
  if (!comment.ok) throw new Error(`hardening comment not created: ${comment.reason}`);

  const vendor = await createUser({ email: `hx-vendor-${stamp}@hx-${label.toLowerCase()}.test`, name: "Vic Vendor" });
  await upsertMember({ projectId: project.id, userId: vendor.id, role: "vendor", companyId: await getOrCreateCompany(`HX Machines ${label} ${stamp}`) });
  const vendorActor = { userId: vendor.id, isAdmin: false };
  const machineNames = parsed.input.machines.map((m) => m.name);
  const { requestId } = await sendDataRequest(owner, project.id, { foundationId: foundation.id, contact: { kind: "member", userId: vendor.id }, machineNames, message: "hardening", dueOn: null });
  const checked = validateMachines(sampleAnalysisInput().machines);
  if (!checked.ok) throw new Error("the sample machines are not valid vendor data");
  const pdf = onePagePdf();
  const drawing = await createRequestDrawing(vendorActor, project.id, requestId, { fileName: "ga.pdf", bytes: pdf });
  const { submissionId } = await submitMachineData(vendorActor, project.id, requestId, { source: "form", machines: checked.machines, file: null, drawingIds: [drawing.id], note: "" });

  const memberId = (await listMembers(owner, project.id)).find((m) => m.userId === owner.userId)?.memberId;
  if (!memberId) throw new Error("the owner is not a member of the hardening project");
  return {
    projectId: project.id,
    code,
    foundationId: foundation.id,
    foundationTag,
    revisionId: issued.revision.id,
    commentId: comment.comment.id,
    requestId,
    submissionId,
    fileId: drawing.id,
    memberId,
    vendorId: vendor.id,
    vendorCookie: await cookieFor(vendor.id),
    checkerId: checker.id,
    checkerCookie: await cookieFor(checker.id),
  };
}
