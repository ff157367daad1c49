"use server";

import { z } from "zod";
import { AppError } from "@/modules/platform/errors";
import { readFormTerms } from "@/modules/vendor-data/form-terms";
import { validateMachines } from "@/modules/vendor-data/validate";
import { getRequestScope, type RequestedMachine } from "@/db/queries/vendor-requests";
import { defineAction } from "../../../../_lib/action";
import { acceptSubmission, requestPath, returnSubmission, sendDataRequest, submitMachineData, type ContactChoice } from "./vendor-service";

const uuid = (what: string) => z.string({ error: `${what} is required` }).uuid({ error: `${what} is not valid` });
const text = (max: number) => z.string().trim().max(max, { error: `must be at most ${max} characters` });

const sendRequestSchema = z
  .object({
    projectId: uuid("project"),
    foundationId: uuid("foundation"),
    // "member:<userId>" for a vendor member of the project, "new" for a contact to invite.
    contact: z.string({ error: "choose a vendor contact" }).regex(/^(new|member:[0-9a-f-]{36})$/i, { error: "choose a vendor contact" }),
    newEmail: z.string().trim().optional(),
    newName: text(120).optional(),
    newCompany: text(120).optional(),
    machineNames: z.string({ error: "list the machines" }).trim().min(1, { error: "list at least one machine, one per line" }),
    message: text(2000).default(""),
    dueOn: z.union([z.literal(""), z.iso.date({ error: "must be a date (YYYY-MM-DD)" })]).optional(),
  })
  .superRefine((v, ctx) => {
    if (v.contact !== "new") return;
    if (!v.newEmail || !z.email().safeParse(v.newEmail).success) ctx.addIssue({ code: "custom", path: ["newEmail"], message: "a valid e-mail address is needed for a new contact" });
    if (!v.newName) ctx.addIssue({ code: "custom", path: ["newName"], message: "the contact's name is needed" });
    if (!v.newCompany) ctx.addIssue({ code: "custom", path: ["newCompany"], message: "the vendor company is needed" });
  });

export const sendDataRequestAction = defineAction({
  name: "vendor.sendRequest",
  access: { kind: "project", permission: "vendorRequest.create" },
  schema: sendRequestSchema,
  projectId: (i) => i.projectId,
  handler: async (ctx, input) => {
    const names = [...new Set(input.machineNames.split(/\r?\n/).map((s) => s.trim()).filter(Boolean))];
    if (names.length > 12) throw new AppError("invalid_input", undefined, [{ path: "machineNames", message: "at most 12 machines per request" }]);
    const contact: ContactChoice =
      input.contact === "new"
        ? { kind: "new", email: input.newEmail ?? "", name: input.newName ?? "", company: input.newCompany ?? "" }
        : { kind: "member", userId: input.contact.slice("member:".length) };
    const sent = await sendDataRequest(ctx.auth!.actor, input.projectId, { foundationId: input.foundationId, contact, machineNames: names, message: input.message, dueOn: input.dueOn || null });
    return { ...sent, projectId: input.projectId };
  },
  redirectTo: (d) => requestPath(d.projectId, d.requestId),
});

const submitFormSchema = z.object({
  projectId: uuid("project"),
  requestId: uuid("request"),
  // The web form's machines as JSON in the contract's shape (checked below by the contract).
  machines: z.string({ error: "the machine data is missing" }).max(200_000, { error: "the machine data is too large" }),
  drawingIds: z.string().optional(),
  note: text(2000).default(""),
});

export const submitMachineFormAction = defineAction({
  name: "vendor.submitForm",
  access: { kind: "project", permission: "vendorRequest.answer" },
  schema: submitFormSchema,
  projectId: (i) => i.projectId,
  handler: async (ctx, input) => {
    const actor = ctx.auth!.actor;
    const scope = await getRequestScope(actor, input.projectId, input.requestId, "vendorRequest.answer");
    if (!scope) throw new AppError("not_found", "No such data request for your company.");
    let json: unknown;
    try {
      json = JSON.parse(input.machines);
    } catch {
      throw new AppError("invalid_input", undefined, [{ path: "machines", message: "is not valid JSON" }]);
    }
    const requested = scope.request.machines as RequestedMachine[];
    if (!Array.isArray(json) || json.length !== requested.length) {
      throw new AppError("invalid_input", `The request asks for ${requested.length} machine(s).`, [{ path: "machines", message: `give ${requested.length} machine(s)` }]);
    }
    // The form speaks the template's terms: positions from the machine datum, times per rotor.
    const terms = readFormTerms(json);
    const checked = validateMachines(terms.machines);
    const issues = [...terms.issues, ...(checked.ok ? [] : checked.issues)];
    if (!checked.ok || issues.length) throw new AppError("invalid_input", `The form has ${issues.length} problem(s); nothing was stored.`, issues);
    const drawingIds = (input.drawingIds ?? "").split(",").map((s) => s.trim()).filter(Boolean);
    const saved = await submitMachineData(actor, input.projectId, input.requestId, {
      source: "form",
      machines: checked.machines,
      frame: "machine-datum",
      rampTimes: terms.rampTimes,
      file: null,
      drawingIds,
      note: input.note,
    });
    return { ...saved, requestId: input.requestId, projectId: input.projectId };
  },
  redirectTo: (d) => requestPath(d.projectId, d.requestId),
});

const reviewSchema = z.object({
  projectId: uuid("project"),
  submissionId: uuid("submission"),
  draftVersion: z.coerce.number({ error: "the draft version is missing" }).int().min(0),
});

export const acceptSubmissionAction = defineAction({
  name: "vendor.acceptSubmission",
  access: { kind: "project", permission: "vendorSubmission.review" },
  schema: reviewSchema,
  projectId: (i) => i.projectId,
  handler: async (ctx, input) => {
    const r = await acceptSubmission(ctx.auth!.actor, input.projectId, input.submissionId, input.draftVersion);
    return { ...r, projectId: input.projectId };
  },
  redirectTo: (d) => requestPath(d.projectId, d.requestId),
});

const returnSchema = z.object({
  projectId: uuid("project"),
  submissionId: uuid("submission"),
  comment: z.string({ error: "say what needs correcting" }).trim().min(3, { error: "say what needs correcting" }).max(2000),
});

export const returnSubmissionAction = defineAction({
  name: "vendor.returnSubmission",
  access: { kind: "project", permission: "vendorSubmission.review" },
  schema: returnSchema,
  projectId: (i) => i.projectId,
  handler: async (ctx, input) => {
    const r = await returnSubmission(ctx.auth!.actor, input.projectId, input.submissionId, input.comment);
    return { ...r, projectId: input.projectId };
  },
  redirectTo: (d) => requestPath(d.projectId, d.requestId),
});
