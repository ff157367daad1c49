// Issue 18 item 2, no dead end on a new foundation: a draft may be saved incomplete (blanks are
// "is required", a wrong value is still refused); issuing it answers 400 naming the missing
// fields; the project's list and register cope with it; a vendor submission can be taken into
// a foundation that has no saved draft yet.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import ExcelJS from "exceljs";
import { eq } from "drizzle-orm";
import { closeDb, getDb } from "@/db/client";
import { foundationDrafts, foundations } from "@/db/schema";
import { createFoundation } from "@/db/queries/projects";
import { getDraft, listFoundationsWithDrafts } from "@/db/queries/drafts";
import { createVendorRequest } from "@/db/queries/vendor-requests";
import { createVendorSubmission } from "@/db/queries/vendor-submissions";
import type { MachineInput } from "@/modules/calc/schema";
import { emptyDraftForm, newMachine, toInputDocument } from "@/modules/desk/draft-form";
import { acceptSubmissionAction } from "@/app/(desk)/projects/[projectId]/requests/actions";
import { issueRevisionAction } from "@/app/(desk)/projects/[projectId]/foundations/[foundationId]/revisions/actions";
import { callAction, callRoute, getFixture, type Fixture } from "./support/fixture";
import { sampleAnalysisInput } from "./analysis-input-sample";

const DRAFT = "v1/projects/[projectId]/foundations/[foundationId]/draft";
const REVISIONS = "v1/projects/[projectId]/foundations/[foundationId]/revisions";
const REGISTER = "v1/projects/[projectId]/register";

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- response bodies are read loosely; the assertions pin them down
type Loose = Record<string, any>;

let fx: Fixture;
const made: string[] = [];
const stamp = Date.now();

async function newFoundation(tag: string): Promise<{ projectId: string; foundationId: string }> {
  const f = await createFoundation({ userId: fx.userIds.manager, isAdmin: false }, fx.projectId, { tag: `${tag}-${stamp}`, machineTrain: "Incomplete draft", location: "" });
  made.push(f.id);
  return { projectId: fx.projectId, foundationId: f.id };
}

/** The new foundation's form with one machine that has only a name, as the workspace sends it. */
function nameOnlyDocument(): unknown {
  const form = emptyDraftForm();
  form.machines = [{ ...newMachine(1), name: "Feed pump" }];
  return toInputDocument(form);
}

beforeAll(async () => {
  fx = await getFixture();
});
afterAll(async () => {
  for (const id of made) await getDb().delete(foundations).where(eq(foundations.id, id));
  await closeDb();
});

describe("an incomplete draft", () => {
  let p: { projectId: string; foundationId: string };
  beforeAll(async () => {
    p = await newFoundation("INC");
  });

  it("saves with 200 and is stored as sent; reading it back says incomplete", async () => {
    const doc = nameOnlyDocument();
    const res = await callRoute(DRAFT, "PUT", p, { cookie: fx.cookies.designer, body: { version: 0, input: doc } });
    expect(res.status).toBe(200);
    const body = (await res.json()) as Loose;
    expect(body.draft).toMatchObject({ version: 1, input: null, incomplete: true });
    const [row] = await getDb().select().from(foundationDrafts).where(eq(foundationDrafts.foundationId, p.foundationId));
    expect(row?.input).toEqual(doc);
    const got = (await (await callRoute(DRAFT, "GET", p, { cookie: fx.cookies.designer })).json()) as Loose;
    expect(got.draft.document.machines[0].name).toBe("Feed pump");
    expect(got.draft.incomplete).toBe(true);
  });

  it("a wrong value beside the blanks is still refused with 400, and nothing stored changes", async () => {
    const doc = nameOnlyDocument() as Loose;
    doc.machines[0].mass = -20;
    const res = await callRoute(DRAFT, "PUT", p, { cookie: fx.cookies.designer, body: { version: 1, input: doc } });
    expect(res.status).toBe(400);
    const issues = ((await res.json()) as Loose).error.issues as { path: string; message: string }[];
    expect(issues).toContainEqual({ path: "machines[0].mass", message: "must be greater than 0" });
    expect((await getDraft({ userId: fx.userIds.designer, isAdmin: false }, p.projectId, p.foundationId))?.version).toBe(1);
  });

  it("the contract's limits still hold on an incomplete draft", async () => {
    const doc = nameOnlyDocument() as Loose;
    doc.machines[0].cg = [0, 0, 1e40];
    const res = await callRoute(DRAFT, "PUT", p, { cookie: fx.cookies.designer, body: { version: 1, input: doc } });
    expect(res.status).toBe(400);
  });

  it("issuing it answers 400 naming the missing fields as required", async () => {
    const res = await callRoute(REVISIONS, "POST", p, { cookie: fx.cookies.designer, body: { note: "Issue an incomplete draft." } });
    expect(res.status).toBe(400);
    const issues = ((await res.json()) as Loose).error.issues as { path: string; message: string }[];
    const byPath = Object.fromEntries(issues.map((i) => [i.path, i.message]));
    expect(byPath["input.soil.density"]).toBe("is required");
    expect(byPath["input.machines[0].mass"]).toBe("is required");
    expect(issues.some((i) => /finite/.test(i.message))).toBe(false);
    // The issue form shows one line: it names the missing fields.
    const { state } = await callAction(issueRevisionAction, { ...p, note: "Issue an incomplete draft." }, fx.cookies.designer);
    expect(state).toMatchObject({ ok: false, code: "invalid_input" });
    expect((state as { message: string }).message).toMatch(/incomplete.*soil\.density.*machines\[0\]\.mass|incomplete.*machines\[0\]\.mass.*soil\.density/);
  });

  it("the project's foundation list (the project page's data) and the register do not fail on it", async () => {
    const list = await listFoundationsWithDrafts({ userId: fx.userIds.manager, isAdmin: false }, fx.projectId);
    const mine = list.find((f) => f.id === p.foundationId);
    expect(mine).toMatchObject({ input: null, incomplete: true, draftVersion: 1, machineNames: ["Feed pump"] });
    const res = await callRoute(REGISTER, "GET", { projectId: fx.projectId }, { cookie: fx.cookies.manager });
    expect(res.status).toBe(200);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(Buffer.from(await res.arrayBuffer()) as unknown as ArrayBuffer);
    const cells = JSON.stringify(wb.worksheets[0]?.getSheetValues());
    expect(cells).toContain(`INC-${stamp}`);
    expect(cells).toContain("draft v1, incomplete, not issued");
  });
});

describe("vendor data into a new foundation", () => {
  it("a submission is taken into a foundation with no saved draft: the draft starts with its machines", async () => {
    const p = await newFoundation("INC-VENDOR");
    const machines = sampleAnalysisInput().machines as MachineInput[];
    const request = await createVendorRequest({ userId: fx.userIds.designer, isAdmin: false }, fx.projectId, {
      foundationId: p.foundationId,
      contactUserId: fx.userIds.vendor,
      message: "",
      dueOn: null,
      machines: machines.map((m) => ({ name: m.name, values: null })),
    });
    const { submission } = await createVendorSubmission({ userId: fx.userIds.vendor, isAdmin: false }, fx.projectId, request.id, { source: "form", machines, file: null, drawingIds: [], note: "" });
    const { state } = await callAction(acceptSubmissionAction, { projectId: fx.projectId, submissionId: submission.id, draftVersion: "0" }, fx.cookies.designer);
    expect(state).toMatchObject({ ok: true });
    const draft = await getDraft({ userId: fx.userIds.designer, isAdmin: false }, p.projectId, p.foundationId);
    expect(draft).toMatchObject({ version: 1, vendorSubmissionId: submission.id, incomplete: true });
    expect((draft?.document as Loose | null)?.machines).toEqual(machines);
    // the soil is still to be entered: the draft waits for it, it does not fail
    expect((draft?.document as Loose | null)?.soil.density).toBeNull();
  });
});
