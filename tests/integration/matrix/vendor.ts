// Role-matrix rows for the vendor data routes and actions. Rows run against the demo's
// request to Corvane Pumps (the demo vendor's own company), so an allowed vendor gets
// through both the permission map and the company check; bodies are chosen so allowed
// calls change nothing (a JSON body where a file is expected, an already reviewed version).
import { permissionMap } from "@/modules/platform/permissions";
import { getVendorRequest, listVendorRequests } from "@/db/queries/vendor-requests";
import {
  acceptSubmissionAction,
  returnSubmissionAction,
  sendDataRequestAction,
  submitMachineFormAction,
} from "@/app/(desk)/projects/[projectId]/requests/actions";
import type { Fixture, MatrixRole } from "../support/fixture";
import type { ActionCase, RouteCase } from "../support/matrix-types";

const REQUESTS = "v1/projects/[projectId]/requests";
const REQUEST = `${REQUESTS}/[requestId]`;

export interface DemoRequest {
  projectId: string;
  requestId: string;
  latestSubmissionId: string;
  latestFileId: string;
}

/** The demo's request for PH1-P101, with its newest (already accepted) version and file. */
export async function demoRequest(fx: Fixture): Promise<DemoRequest> {
  const manager = { userId: fx.userIds.manager, isAdmin: false };
  const list = await listVendorRequests(manager, fx.projectId);
  const seeded = list.find((r) => r.foundationTag === "PH1-P101" && r.companyName === "Corvane Pumps" && r.latestVersion !== null && r.latestVersion >= 2);
  if (!seeded) throw new Error("the demo data request is missing: was the database seeded?");
  const detail = await getVendorRequest(manager, fx.projectId, seeded.id);
  const latest = detail?.submissions.find((s) => s.file);
  if (!latest?.file) throw new Error("the demo request has no workbook version");
  return { projectId: fx.projectId, requestId: seeded.id, latestSubmissionId: latest.id, latestFileId: latest.file.id };
}

const readers: MatrixRole[] = [...permissionMap["vendorRequest.readOwn"]];
const answerers: MatrixRole[] = [...permissionMap["vendorRequest.answer"]];
const reviewers: MatrixRole[] = [...permissionMap["vendorSubmission.review"]];

const requestParams = async (fx: Fixture) => {
  const d = await demoRequest(fx);
  return { params: { projectId: d.projectId, requestId: d.requestId } };
};

export const routeCases: RouteCase[] = [
  { route: REQUESTS, method: "GET", allowed: readers, request: async (fx) => ({ params: { projectId: fx.projectId } }) },
  { route: REQUEST, method: "GET", allowed: readers, request: requestParams },
  { route: `${REQUEST}/workbook`, method: "GET", allowed: readers, request: requestParams },
  { route: `${REQUEST}/csv-template`, method: "GET", allowed: readers, request: requestParams },
  // A JSON body is not an upload: the vendor gets a 400, every other role is refused first.
  { route: `${REQUEST}/submissions`, method: "POST", allowed: answerers, request: async (fx) => ({ ...(await requestParams(fx)), body: { file: "not a file" } }) },
  { route: `${REQUEST}/drawings`, method: "POST", allowed: answerers, request: async (fx) => ({ ...(await requestParams(fx)), body: { file: "not a file" } }) },
  {
    route: "v1/projects/[projectId]/files/[fileId]",
    method: "GET",
    // Designers, managers and checkers of the project, and the vendor whose company's request it is.
    allowed: ["manager", "designer", "checker", "vendor"],
    request: async (fx) => {
      const d = await demoRequest(fx);
      return { params: { projectId: d.projectId, fileId: d.latestFileId } };
    },
  },
];

export const actionCases: ActionCase[] = [
  {
    name: "vendor.sendRequest",
    action: sendDataRequestAction,
    allowed: [...permissionMap["vendorRequest.create"]],
    // No machines listed: an allowed caller gets field errors and nothing is sent.
    fields: async (fx) => ({ projectId: fx.projectId, foundationId: fx.foundationIds[0] ?? "", contact: `member:${fx.userIds.vendor}`, machineNames: "" }),
  },
  {
    // A request to a new contact adds a member, so it is the manager's invitation: a
    // designer, who may send requests to vendor members, is refused here.
    name: "vendor.sendRequest",
    action: sendDataRequestAction,
    allowed: ["manager"],
    fields: async (fx, role) => ({
      projectId: fx.projectId,
      foundationId: fx.foundationIds[0] ?? "",
      contact: "new",
      newEmail: `matrix-contact-${role}-${Date.now()}@matrix-vendor.test`,
      newName: "Matrix Contact",
      newCompany: `Matrix Vendor ${role}`,
      machineNames: "Matrix pump",
    }),
  },
  {
    name: "vendor.submitForm",
    action: submitMachineFormAction,
    allowed: answerers,
    fields: async (fx) => {
      const d = await demoRequest(fx);
      return { projectId: d.projectId, requestId: d.requestId, machines: "not JSON" };
    },
  },
  {
    name: "vendor.acceptSubmission",
    action: acceptSubmissionAction,
    allowed: reviewers,
    // Already accepted in the demo: an allowed caller gets a conflict, the draft is untouched.
    fields: async (fx) => {
      const d = await demoRequest(fx);
      return { projectId: d.projectId, submissionId: d.latestSubmissionId, draftVersion: "1" };
    },
  },
  {
    name: "vendor.returnSubmission",
    action: returnSubmissionAction,
    allowed: reviewers,
    fields: async (fx) => {
      const d = await demoRequest(fx);
      return { projectId: d.projectId, submissionId: d.latestSubmissionId, comment: "Matrix check: already reviewed." };
    },
  },
];
