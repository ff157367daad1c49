// Site measurements (commissioning) against the real PostgreSQL and the fake SMTP server: a
// record added through the real route on an approved revision, its verdicts stored, the
// database refusing to change it, a correction as a new record; the company rule; a bad file
// refused naming its cell with nothing stored; a calibration outside the soil band flagging the
// foundation and mailing the designer and the checker; the template downloaded, filled and
// uploaded by the vendor's field staff.
import ExcelJS from "exceljs";
import { count, eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, getDb } from "@/db/client";
import { auditEvents, foundations, measurementRecords } from "@/db/schema";
import { createUser } from "@/db/queries/accounts";
import { getOrCreateCompany, upsertMember } from "@/db/queries/projects";
import { Predictor } from "@/modules/commissioning/prediction";
import { buildResponseModel, findPoint, modelPoints, SoilResponse } from "@/modules/commissioning/response";
import { READINGS_SHEET } from "@/modules/commissioning/readings";
import { MEASUREMENTS_SHEET, REGISTER_SHEETS } from "@/modules/calc-package";
import { readTables, tableByTitle, toStored } from "../unit/calc-package/read-tables";
import { callRoute, cookieFor, demoEmail, getFixture, waitForEmail, type Fixture } from "./support/fixture";
import { commissioningFoundation, postMeasurement, recordFields, type CommissioningFoundation } from "./support/commissioning-fixture";

const BASE = "v1/projects/[projectId]/foundations/[foundationId]/revisions/[revisionId]/measurements";
const stamp = Date.now().toString(36);
const B1 = "Motor RWM-101 rotor bearing 1";

let fx: Fixture;
let cf: CommissioningFoundation;
let otherVendorCookie: string;

type ErrorBody = { error: { code: string; message: string; issues?: { path: string; message: string }[] } };
type Created = { record: { id: string; sha256: string; supersedesId: string | null }; soilFlag: unknown };

const csv = (rows: string[]) => Buffer.from(["bearing,direction,quantity,unit,value", ...rows].join("\r\n") + "\r\n", "utf8");
const params = (c: CommissioningFoundation) => ({ projectId: c.projectId, foundationId: c.foundationId, revisionId: c.revisionId });

async function recordCount(foundationId: string): Promise<number> {
  const rows = await getDb().select({ n: count() }).from(measurementRecords).where(eq(measurementRecords.foundationId, foundationId));
  return rows[0]?.n ?? 0;
}

beforeAll(async () => {
  fx = await getFixture();
  cf = await commissioningFoundation(fx);
  const other = await createUser({ email: `field-${stamp}@other-vendor.test`, name: "Other Field Technician" });
  await upsertMember({ projectId: fx.projectId, userId: other.id, role: "vendor", companyId: await getOrCreateCompany(`Other Vendor ${stamp}`) });
  otherVendorCookie = await cookieFor(other.id);
});

afterAll(async () => {
  await closeDb();
});

describe("a site measurement record on an approved revision", () => {
  let first: Created;

  it("designer uploads a CSV: 201, verdicts with prediction stored, file hash kept", async () => {
    const file = csv([`${B1},vertical,velocity rms,mm/s,0.9`, `${B1},horizontal,velocity rms,mm/s,3.1`, `${B1},axial,displacement peak-to-peak,µm,8`]);
    const res = await postMeasurement(fx.cookies.designer, cf, file, "survey.csv", recordFields());
    expect(res.status).toBe(201);
    first = (await res.json()) as Created;
    expect(first.record.sha256).toMatch(/^[0-9a-f]{64}$/);
    const [row] = await getDb().select().from(measurementRecords).where(eq(measurementRecords.id, first.record.id));
    const verdicts = row!.verdicts as { record: { verdict: string }; readings: { verdict: string; predicted: number | null; ratio: number | null; zone: string | null; value: number }[] };
    expect(verdicts.readings).toHaveLength(3);
    // 3.1 mm/s r.m.s. is above the default 1.4 mm/s criterion: the record fails
    expect(verdicts.record.verdict).toBe("fail");
    expect(verdicts.readings[0]!.verdict).toBe("pass");
    expect(verdicts.readings[0]!.value).toBeCloseTo(0.9e-3 * Math.SQRT2, 12);
    expect(verdicts.readings.every((r) => r.predicted !== null && r.predicted > 0 && r.ratio !== null)).toBe(true);
    expect(row!.calibration).toBeNull();
    expect(row!.companyId).toBeNull();
  });

  it("is immutable in the database itself: UPDATE and DELETE are refused by the trigger", async () => {
    // drizzle wraps the driver's error; PostgreSQL's own message is its cause
    const refusal = async (q: Promise<unknown>) => {
      try {
        await q;
      } catch (e) {
        return String((e as { cause?: { message?: string } }).cause?.message ?? (e as Error).message);
      }
      return "not refused";
    };
    expect(await refusal(getDb().execute(sql`UPDATE measurement_records SET measured_by = 'someone else' WHERE id = ${first.record.id}`))).toMatch(/measurement_records rows are immutable: UPDATE refused/);
    expect(await refusal(getDb().execute(sql`DELETE FROM measurement_records WHERE id = ${first.record.id}`))).toMatch(/immutable: DELETE refused/);
    const [row] = await getDb().select({ by: measurementRecords.measuredBy }).from(measurementRecords).where(eq(measurementRecords.id, first.record.id));
    expect(row!.by).toBe("Field technician (test)");
  });

  it("a correction is a new record pointing at the one it corrects; both stay listed", async () => {
    const res = await postMeasurement(fx.cookies.designer, cf, csv([`${B1},vertical,velocity rms,mm/s,0.95`]), "survey-corrected.csv", recordFields({ supersedesId: first.record.id, note: "first file had the wrong unit" }));
    expect(res.status).toBe(201);
    const corrected = (await res.json()) as Created;
    expect(corrected.record.id).not.toBe(first.record.id);
    expect(corrected.record.supersedesId).toBe(first.record.id);
    const list = await callRoute(BASE, "GET", params(cf), { cookie: fx.cookies.checker });
    expect(list.status).toBe(200);
    const { records } = (await list.json()) as { records: { id: string }[] };
    expect(records.map((r) => r.id)).toEqual(expect.arrayContaining([first.record.id, corrected.record.id]));
  });

  it("a bad file is refused with 400 naming the cell, and nothing is stored", async () => {
    const before = await recordCount(cf.foundationId);
    const res = await postMeasurement(fx.cookies.designer, cf, csv([`${B1},vertical,velocity rms,mm/s,0.9`, `${B1},sideways,velocity rms,mm/s,1.2`, `bearing 7,vertical,velocity rms,mm/s,abc`]), "bad.csv", recordFields());
    expect(res.status).toBe(400);
    const body = (await res.json()) as ErrorBody;
    const paths = body.error.issues?.map((i) => i.path) ?? [];
    expect(paths).toEqual(expect.arrayContaining(["CSV!B3", "CSV!A4", "CSV!E4"]));
    expect(body.error.issues?.find((i) => i.path === "CSV!B3")?.message).toMatch(/sideways/);
    expect(await recordCount(cf.foundationId)).toBe(before);
  });

  it("a vendor of another company gets 404 and stores nothing; a record on an unapproved revision is refused", async () => {
    const before = await recordCount(cf.foundationId);
    const res = await postMeasurement(otherVendorCookie, cf, csv([`${B1},vertical,velocity rms,mm/s,0.9`]), "survey.csv", recordFields());
    expect(res.status).toBe(404);
    const list = await callRoute(BASE, "GET", params(cf), { cookie: otherVendorCookie });
    expect(list.status).toBe(404);
    expect(await recordCount(cf.foundationId)).toBe(before);
    const inCheck = await commissioningFoundation(fx, { approved: false });
    const refused = await postMeasurement(fx.cookies.designer, inCheck, csv([`${B1},vertical,velocity rms,mm/s,0.9`]), "survey.csv", recordFields());
    expect(refused.status).toBe(409);
    expect(await recordCount(inCheck.foundationId)).toBe(0);
  });
});

describe("calibration from a measured resonance", () => {
  it("a fitted G outside the band flags the foundation and mails the designer and the checker; a later fit inside clears it", async () => {
    const c = await commissioningFoundation(fx);
    // the vertical mode as the engine gives it at 0.4 x the design G (the band's lower end is 1 / 1.5)
    const hz = new Predictor(c.input).design.naturalHz[2]! * Math.sqrt(0.4);
    const res = await postMeasurement(fx.cookies.designer, c, csv([`${B1},vertical,velocity rms,mm/s,0.9`, `${B1},vertical,resonance,Hz,${hz.toFixed(4)}`]), "bump-test.csv", recordFields());
    expect(res.status).toBe(201);
    const created = (await res.json()) as Created;
    expect(created.soilFlag).toMatchObject({ side: "below" });
    const [f] = await getDb().select({ flag: foundations.soilFlag }).from(foundations).where(eq(foundations.id, c.foundationId));
    expect(f!.flag).toMatchObject({ recordId: created.record.id, side: "below" });
    const [row] = await getDb().select({ calibration: measurementRecords.calibration }).from(measurementRecords).where(eq(measurementRecords.id, created.record.id));
    const cal = row!.calibration as { fittedShearModulus: number; designShearModulus: number; position: string };
    expect(cal.position).toBe("below");
    expect(cal.fittedShearModulus / cal.designShearModulus).toBeCloseTo(0.4, 2);
    const events = await getDb().select({ action: auditEvents.action }).from(auditEvents).where(sql`${auditEvents.detail}->>'recordId' = ${created.record.id}`);
    expect(events.map((e) => e.action).sort()).toEqual(["foundation.soil-flag-raised", "measurement.recorded"]);
    for (const role of ["designer", "checker"]) {
      const mail = await waitForEmail(demoEmail(role), `${c.tag}: site-measured soil outside the design band`);
      expect(mail.text).toMatch(/below the design band/);
      expect(mail.text).toContain(created.record.id);
    }
    const inside = await postMeasurement(fx.cookies.manager, c, csv([`${B1},vertical,resonance,Hz,${(new Predictor(c.input).design.naturalHz[2]! * Math.sqrt(1.1)).toFixed(4)}`]), "resurvey.csv", recordFields());
    expect(inside.status).toBe(201);
    const [g] = await getDb().select({ flag: foundations.soilFlag }).from(foundations).where(eq(foundations.id, c.foundationId));
    expect(g!.flag).toBeNull();

    // the package carries a Site measurements sheet with both records; the register the latest verdict and fitted G
    const pkg = await callRoute("v1/projects/[projectId]/foundations/[foundationId]/revisions/[revisionId]/package", "GET", params(c), { cookie: fx.cookies.manager });
    expect(pkg.status).toBe(200);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(Buffer.from(await pkg.arrayBuffer()) as unknown as ExcelJS.Buffer);
    const sheet = wb.getWorksheet(MEASUREMENTS_SHEET);
    expect(sheet).toBeDefined();
    const records = tableByTitle(readTables(sheet!), "Records");
    const sha = records.headers.indexOf("SHA-256");
    expect(records.rows.map((r) => r[sha])).toEqual(expect.arrayContaining([created.record.sha256]));
    expect(records.rows).toHaveLength(2);
    const reg = await callRoute("v1/projects/[projectId]/register", "GET", { projectId: c.projectId }, { cookie: fx.cookies.manager });
    expect(reg.status).toBe(200);
    const rwb = new ExcelJS.Workbook();
    await rwb.xlsx.load(Buffer.from(await reg.arrayBuffer()) as unknown as ExcelJS.Buffer);
    const table = tableByTitle(readTables(rwb.getWorksheet(REGISTER_SHEETS.register)!), "Foundations");
    const regRow = table.rows.find((r) => r[0] === c.tag)!;
    const gCol = table.headers.findIndex((h) => h.startsWith("Fitted soil G"));
    const fitted = toStored(regRow[gCol] as number, table.headers[gCol]!);
    const g0 = cal.designShearModulus;
    // the latest record (fitted at 1.1 x G0) is the one the register shows
    expect(fitted / g0).toBeCloseTo(1.1, 2);
  });
});

describe("a run-up trace", () => {
  it("is stored with the predicted curve and its resonance, and the soil fitted to it (synthetic trace at 1.3 G0: inside the band)", async () => {
    const c = await commissioningFoundation(fx);
    const model = buildResponseModel(c.input);
    const truth = new SoilResponse(model, 1.3);
    const point = findPoint(modelPoints(model), B1)!;
    const rows = Array.from({ length: 151 }, (_, i) => 300 + i * 10).map((rpm) => `${B1},horizontal,displacement peak-to-peak,µm,${rpm},${(2 * truth.at(point, 1, rpm).displacementPeak * 1e6).toFixed(4)}`);
    const file = Buffer.from(["bearing,direction,quantity,unit,speed_rpm,value", ...rows].join("\n"), "utf8");
    const res = await postMeasurement(fx.cookies.designer, c, file, "run-up.csv", recordFields({ kind: "run-up" }));
    expect(res.status).toBe(201);
    const created = (await res.json()) as Created;
    expect(created.soilFlag).toBeNull();
    const [row] = await getDb().select().from(measurementRecords).where(eq(measurementRecords.id, created.record.id));
    const v = row!.verdicts as { resonances: { rpm: number }[]; tracePlot: { measured: unknown[]; predicted: { value: number }[] }; readings: { location: string }[] };
    expect(v.resonances.length).toBeGreaterThan(0);
    expect(v.tracePlot.measured).toHaveLength(151);
    expect(v.tracePlot.predicted).toHaveLength(151);
    // the sample nearest 1785 rpm (1780, the first of two as near) is judged like a reading
    expect(v.readings.map((r) => r.location)).toEqual([`${B1} (trace at 1780 rpm)`]);
    const cal = row!.calibration as { fittedShearModulus: number; designShearModulus: number; position: string };
    expect(cal.position).toBe("inside");
    // the trace's values are rounded to 0.1 nm and its steps are 10 rpm: 1 % on G
    expect(Math.abs(cal.fittedShearModulus / cal.designShearModulus / 1.3 - 1)).toBeLessThan(0.01);
    expect((row!.trace as { samples: unknown[] }).samples).toHaveLength(151);
  });
});

describe("the vendor's field staff", () => {
  it("download the template, fill it and upload it: the record carries their company and they see it without the design side", async () => {
    const tpl = await callRoute(`${BASE}/template`, "GET", params(cf), { cookie: fx.cookies.vendor });
    expect(tpl.status).toBe(200);
    expect(tpl.headers.get("content-type")).toMatch(/spreadsheetml/);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(Buffer.from(await tpl.arrayBuffer()) as unknown as ExcelJS.Buffer);
    const ws = wb.getWorksheet(READINGS_SHEET)!;
    expect(ws.getCell("A2").value).toBe(B1);
    ws.getCell("E2").value = 1.1;
    ws.getCell("E3").value = 1.6;
    const badGroup = await postMeasurement(fx.cookies.vendor, cf, Buffer.from(await wb.xlsx.writeBuffer()), "acceptance-test.xlsx", recordFields({ machineGroup: "3" }));
    expect(badGroup.status).toBe(400);
    expect(((await badGroup.json()) as ErrorBody).error.issues?.map((i) => i.path)).toEqual(["machineGroup"]);
    const res = await postMeasurement(fx.cookies.vendor, cf, Buffer.from(await wb.xlsx.writeBuffer()), "acceptance-test.xlsx", recordFields({ measuredBy: "Vendor field engineer", machineGroup: "1" }));
    expect(res.status).toBe(201);
    const created = (await res.json()) as Created;
    const [row] = await getDb().select({ companyId: measurementRecords.companyId, verdicts: measurementRecords.verdicts }).from(measurementRecords).where(eq(measurementRecords.id, created.record.id));
    expect(row!.companyId).not.toBeNull();
    expect((row!.verdicts as { zoneBasis: string }).zoneBasis).toMatch(/^machine group 1 \(as stated on the record\)/);
    const list = await callRoute(BASE, "GET", params(cf), { cookie: fx.cookies.vendor });
    const { records } = (await list.json()) as { records: { id: string; calibration: unknown; verdicts: { readings: { verdict: string; predicted: number | null; ratio: number | null }[] } }[] };
    // the vendor sees its own company's record only, not the design team's, and no prediction
    expect(records.map((r) => r.id)).toEqual([created.record.id]);
    expect(records[0]!.verdicts.readings.map((r) => [r.verdict, r.predicted, r.ratio])).toEqual([
      ["pass", null, null],
      ["fail", null, null],
    ]);
    expect(records[0]!.calibration).toBeNull();
    const designer = await callRoute(`${BASE}/[recordId]`, "GET", { ...params(cf), recordId: created.record.id }, { cookie: fx.cookies.designer });
    expect(designer.status).toBe(200);
    expect(JSON.stringify(await designer.json())).toMatch(/"predicted":\d/);
  });
});
