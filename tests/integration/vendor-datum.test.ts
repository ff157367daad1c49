// Vendor data in the vendor's terms (issue 18, item 6), against the real PostgreSQL: the
// designer places the machine datum through PUT .../draft, the workbook (template version 2)
// comes prefilled in the machine's terms, an upload through the real route gives positions
// from the datum and start-up/coast-down times, taking it in converts to block coordinates
// and retimes the speed-ramp run, the draft and the issued revision keep the datum and the
// vendor's own figures; a version 1 workbook is stored as block coordinates.
import ExcelJS from "exceljs";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, getDb } from "@/db/client";
import { foundationDrafts, revisions, vendorSubmissions } from "@/db/schema";
import { getDraft, saveDraft } from "@/db/queries/drafts";
import { createFoundation } from "@/db/queries/projects";
import { getRevision, issueRevision } from "@/db/queries/revisions";
import { readPlacements } from "@/modules/desk/machine-placements";
import { MARKER_SHEET, machineFieldRow, rampFieldRow, rotorFieldRow } from "@/modules/vendor-data/layout";
import type { MachineInput } from "@/modules/calc/schema";
import { acceptSubmissionAction, sendDataRequestAction, submitMachineFormAction } from "@/app/(desk)/projects/[projectId]/requests/actions";
import { POST as postSubmission } from "@/app/api/v1/projects/[projectId]/requests/[requestId]/submissions/route";
import { callAction, callRoute, getFixture, type Fixture } from "./support/fixture";
import { sampleAnalysisInput } from "./analysis-input-sample";

const REQUEST = "v1/projects/[projectId]/requests/[requestId]";
const DRAFT = "v1/projects/[projectId]/foundations/[foundationId]/draft";
const stamp = Date.now().toString(36);
// The fan's datum: origin at (0.2, -0.1, 2.0) m on the block, machine x along block -x (180°).
const DATUM = { origin: [0.2, -0.1, 2.0] as [number, number, number], rotationDeg: 180 as const };

let fx: Fixture;
let foundationId: string;
let requestId: string;

const actor = (role: "designer" | "manager") => ({ userId: fx.userIds[role], isAdmin: false });

async function upload(cookie: string | null, file: Buffer, name: string): Promise<Response> {
  const form = new FormData();
  form.append("file", new Blob([new Uint8Array(file)]), name);
  const headers = { host: "127.0.0.1:3100", origin: "http://127.0.0.1:3100", cookie: cookie ?? "" };
  return postSubmission(new Request("http://127.0.0.1:3100/api/upload", { method: "POST", headers, body: form }), { params: Promise.resolve({ projectId: fx.projectId, requestId }) });
}

async function workbook(): Promise<ExcelJS.Workbook> {
  const res = await callRoute(`${REQUEST}/workbook`, "GET", { projectId: fx.projectId, requestId }, { cookie: fx.cookies.vendor });
  expect(res.status).toBe(200);
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(Buffer.from(await res.arrayBuffer()) as unknown as ExcelJS.Buffer);
  return wb;
}

const bytesOf = async (wb: ExcelJS.Workbook) => Buffer.from(await wb.xlsx.writeBuffer());

async function newestSubmission() {
  const rows = await getDb().select().from(vendorSubmissions).where(eq(vendorSubmissions.requestId, requestId));
  return rows.sort((a, b) => b.version - a.version)[0];
}

beforeAll(async () => {
  fx = await getFixture();
  const f = await createFoundation(actor("manager"), fx.projectId, { tag: `IT-DATUM-${stamp}`, machineTrain: "Datum fan train", location: "Test bay" });
  foundationId = f.id;
  const saved = await saveDraft(actor("manager"), fx.projectId, foundationId, { input: sampleAnalysisInput() as never, expectedVersion: 0 });
  expect(saved?.ok).toBe(true);
});

afterAll(async () => {
  await closeDb();
});

describe("vendor data relative to the machine datum", () => {
  it("the designer places the datum through PUT .../draft (with a run-up of the fan), and the value is checked", async () => {
    const draft = await getDraft(actor("designer"), fx.projectId, foundationId);
    const input = { ...sampleAnalysisInput(), transient: [{ machine: "Fan", rotor: "Impeller", kind: "run-up", durationS: 10 }] };
    const bad = await callRoute(DRAFT, "PUT", { projectId: fx.projectId, foundationId }, { cookie: fx.cookies.designer, body: { version: draft?.version, input, placements: [{ machine: "Fan", datum: { origin: [0, 0, 0], rotationDeg: 45 }, vendor: null }] } });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(await bad.json())).toMatch(/0, 90, 180 or 270/);
    const res = await callRoute(DRAFT, "PUT", { projectId: fx.projectId, foundationId }, { cookie: fx.cookies.designer, body: { version: draft?.version, input, placements: [{ machine: "Fan", datum: DATUM, vendor: null }] } });
    expect(res.status).toBe(200);
    const after = await getDraft(actor("designer"), fx.projectId, foundationId);
    expect(after?.placements).toEqual([{ machine: "Fan", datum: DATUM, vendor: null }]);

    const { state } = await callAction(sendDataRequestAction, { projectId: fx.projectId, foundationId, contact: `member:${fx.userIds.vendor}`, machineNames: "Fan", message: `Datum ${stamp}`, dueOn: "" }, fx.cookies.designer);
    expect(state.ok).toBe(true);
    if (state.ok) requestId = (state.data as { requestId: string }).requestId;
  });

  it("the workbook is version 2 and prefilled in the machine's terms through the datum (block (0, 0, 2.2) → machine (0.2, -0.1, 0.2))", async () => {
    const wb = await workbook();
    expect(wb.getWorksheet(MARKER_SHEET)?.getCell("B2").value).toBe(2);
    const ws = wb.getWorksheet("Machine 1")!;
    // Hand-checked: p_machine = Rz(-180°)(p_block - origin) = (0.2 - x, -(y + 0.1), z - 2.0).
    const cg = ["cgX", "cgY", "cgZ"].map((k) => Number(ws.getCell(`C${machineFieldRow(k as "cgX")}`).value));
    [0.2, -0.1, 0.2].forEach((v, i) => expect(cg[i]).toBeCloseTo(v, 12));
    expect(ws.getCell(`C${rotorFieldRow("axis")}`).value).toBe("x");
  });

  it("an upload through the real route stores positions from the datum and the times; taking it in converts and retimes the run", async () => {
    const wb = await workbook();
    const ws = wb.getWorksheet("Machine 1")!;
    ws.getCell(`C${machineFieldRow("cgX")}`).value = 0.5;
    ws.getCell(`C${machineFieldRow("cgY")}`).value = 0;
    ws.getCell(`C${machineFieldRow("cgZ")}`).value = 0.4;
    ws.getCell(`C${rampFieldRow("startUpS")}`).value = 9;
    ws.getCell(`C${rampFieldRow("coastDownS")}`).value = 80;
    const res = await upload(fx.cookies.vendor, await bytesOf(wb), "fan-v2.xlsx");
    expect(res.status).toBe(201);
    const body = (await res.json()) as { frame: string; formatVersion: number; rampTimes: unknown[]; machines: MachineInput[] };
    expect(body).toMatchObject({ frame: "machine-datum", formatVersion: 2, rampTimes: [{ machine: "Fan", rotor: "Impeller", startUpS: 9, coastDownS: 80 }] });
    const stored = await newestSubmission();
    expect(stored?.frame).toBe("machine-datum");
    expect((stored?.machines as MachineInput[])[0]?.cg).toEqual([0.5, 0, 0.4]);

    const draft = await getDraft(actor("designer"), fx.projectId, foundationId);
    const ok = await callAction(acceptSubmissionAction, { projectId: fx.projectId, submissionId: stored!.id, draftVersion: String(draft?.version) }, fx.cookies.designer);
    expect(ok.state.ok).toBe(true);
    const after = await getDraft(actor("designer"), fx.projectId, foundationId);
    const fan = after?.input?.machines[0];
    // Hand-checked: p_block = origin + Rz(180°) p_machine = (0.2 - 0.5, -0.1 - 0, 2.0 + 0.4).
    [-0.3, -0.1, 2.4].forEach((v, i) => expect(fan?.cg[i]).toBeCloseTo(v, 12));
    // the bearings went there and back through the same datum: the block figures again
    fan?.rotors[0]?.bearings.forEach((b, i) => [[-1, 0, 2.2], [1, 0, 2.2]][i]!.forEach((v, a) => expect(b[a]).toBeCloseTo(v, 12)));
    expect(after?.input?.transient?.[0]?.durationS).toBe(9);
    // The trail shows both: the datum and the vendor's own figures, as submitted.
    const vendorMachine = (stored!.machines as MachineInput[])[0];
    expect(after?.placements).toEqual([
      { machine: "Fan", datum: DATUM, vendor: { submissionId: stored!.id, version: stored!.version, frame: "machine-datum", machine: vendorMachine, rampTimes: [{ rotor: "Impeller", startUpS: 9, coastDownS: 80 }] } },
    ]);
  });

  it("a save without placements keeps them; a save cannot rewrite the vendor's figures; the issued revision keeps datum and vendor figures", async () => {
    const draft = await getDraft(actor("designer"), fx.projectId, foundationId);
    const vendor = draft!.placements[0]!.vendor!;
    const keep = await callRoute(DRAFT, "PUT", { projectId: fx.projectId, foundationId }, { cookie: fx.cookies.designer, body: { version: draft?.version, input: draft?.input } });
    expect(keep.status).toBe(200);
    const kept = await getDraft(actor("designer"), fx.projectId, foundationId);
    expect(kept?.placements[0]?.vendor).toEqual(vendor);
    const forged = { ...vendor, machine: { ...vendor.machine, mass: 1 } };
    const forge = await callRoute(DRAFT, "PUT", { projectId: fx.projectId, foundationId }, { cookie: fx.cookies.designer, body: { version: kept?.version, input: kept?.input, placements: [{ machine: "Fan", datum: DATUM, vendor: forged }] } });
    expect(forge.status).toBe(200);
    const row = (await getDb().select().from(foundationDrafts).where(eq(foundationDrafts.foundationId, foundationId)))[0];
    expect(readPlacements(row?.machinePlacements)[0]?.vendor?.machine.mass).toBe(vendor.machine.mass);

    const issued = await issueRevision(actor("designer"), fx.projectId, foundationId, { note: "Vendor data version 1 taken in through the fan's datum" });
    expect(issued.ok).toBe(true);
    if (!issued.ok) return;
    const [rev] = await getDb().select().from(revisions).where(eq(revisions.id, issued.revision.id));
    expect(readPlacements(rev?.machinePlacements)).toEqual(readPlacements(row?.machinePlacements));
    expect(readPlacements(rev?.machinePlacements)[0]?.datum).toEqual(DATUM);
    // the revision page reads them back through getRevision (its "Machines on the block as issued" table)
    const detail = await getRevision(actor("designer"), fx.projectId, foundationId, issued.revision.id);
    expect(detail?.placements).toEqual(readPlacements(rev?.machinePlacements));
    expect(detail?.placements[0]?.vendor?.machine.mass).toBe(vendor.machine.mass);
  });

  it("a version 1 workbook is stored as block coordinates and taken in as it is", async () => {
    const wb = await workbook();
    wb.getWorksheet(MARKER_SHEET)!.getCell("B2").value = 1;
    const ws = wb.getWorksheet("Machine 1")!;
    // version 1 figures are block coordinates
    ws.getCell(`C${machineFieldRow("cgX")}`).value = 0.1;
    ws.getCell(`C${machineFieldRow("cgY")}`).value = 0;
    ws.getCell(`C${machineFieldRow("cgZ")}`).value = 2.3;
    const res = await upload(fx.cookies.vendor, await bytesOf(wb), "fan-v1.xlsx");
    expect(res.status).toBe(201);
    expect(((await res.json()) as { frame: string }).frame).toBe("block");
    const stored = await newestSubmission();
    expect(stored).toMatchObject({ frame: "block", rampTimes: [] });
    const draft = await getDraft(actor("designer"), fx.projectId, foundationId);
    const ok = await callAction(acceptSubmissionAction, { projectId: fx.projectId, submissionId: stored!.id, draftVersion: String(draft?.version) }, fx.cookies.designer);
    expect(ok.state.ok).toBe(true);
    const after = await getDraft(actor("designer"), fx.projectId, foundationId);
    expect(after?.input?.machines).toEqual(stored?.machines);
    expect(after?.placements[0]).toMatchObject({ machine: "Fan", datum: DATUM, vendor: { frame: "block", version: stored?.version } });
  });

  it("the web form speaks the same terms: a shaft along the datum's y is refused naming the field, the times are stored", async () => {
    const draft = await getDraft(actor("designer"), fx.projectId, foundationId);
    const fan = draft!.input!.machines[0]!;
    const rotor = { ...fan.rotors[0]!, axis: "y", startUpS: 11 };
    const bad = await callAction(submitMachineFormAction, { projectId: fx.projectId, requestId, machines: JSON.stringify([{ ...fan, rotors: [rotor] }]) }, fx.cookies.vendor);
    expect(bad.state.ok).toBe(false);
    if (!bad.state.ok) expect(bad.state.fieldErrors?.["machines[0].rotors[0].axis"]?.[0]).toMatch(/horizontal shaft runs along x/);
    const good = await callAction(submitMachineFormAction, { projectId: fx.projectId, requestId, machines: JSON.stringify([{ ...fan, rotors: [{ ...rotor, axis: "x" }] }]) }, fx.cookies.vendor);
    expect(good.state.ok).toBe(true);
    expect(await newestSubmission()).toMatchObject({ source: "form", frame: "machine-datum", rampTimes: [{ machine: "Fan", rotor: "Impeller", startUpS: 11 }] });
  });
});
