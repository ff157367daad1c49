// A foundation of the demo project with an approved revision (the pump train of examples/) and
// a data request to the demo vendor's company, so that every role can be tried on it; and a
// second foundation whose only revision is still in check.
import { readFileSync } from "node:fs";
import path from "node:path";
import { parseAnalysisInput, type AnalysisInput } from "@/modules/calc";
import { createFoundation } from "@/db/queries/projects";
import { createSeedRevision } from "@/db/queries/revisions";
import { createVendorRequest } from "@/db/queries/vendor-requests";
import type { Fixture } from "./fixture";
import { uploadRequest } from "./hardening-helpers";

export function pumpInput(): AnalysisInput {
  const parsed = parseAnalysisInput(JSON.parse(readFileSync(path.join(process.cwd(), "examples", "raw-water-pump-train.json"), "utf8")));
  if (!parsed.ok) throw new Error("examples/raw-water-pump-train.json does not parse");
  return parsed.input;
}

export interface CommissioningFoundation {
  projectId: string;
  foundationId: string;
  revisionId: string;
  tag: string;
  input: AnalysisInput;
}

let n = 0;

/** A fresh foundation with one revision, approved by the checker unless `approved` is false; the vendor's company has a request for it. */
export async function commissioningFoundation(fx: Fixture, opts: { approved?: boolean; input?: AnalysisInput } = {}): Promise<CommissioningFoundation> {
  n += 1;
  const manager = { userId: fx.userIds.manager, isAdmin: false };
  const tag = `CM-${Date.now().toString(36)}-${n}`;
  const f = await createFoundation(manager, fx.projectId, { tag, machineTrain: "Commissioning test train", location: "test bay" });
  const input = opts.input ?? pumpInput();
  const issuedAt = new Date(Date.now() - 86_400_000);
  const revisionId = await createSeedRevision({
    projectId: fx.projectId,
    foundationId: f.id,
    input,
    issuedById: fx.userIds.designer,
    issuedAt,
    editorIds: [fx.userIds.designer],
    note: "Issued for the commissioning tests.",
    decision: opts.approved === false ? undefined : { outcome: "approved", note: "Approved for construction.", decidedById: fx.userIds.checker, decidedByRole: "checker", decidedAt: new Date(issuedAt.getTime() + 3_600_000) },
  });
  await createVendorRequest(manager, fx.projectId, { foundationId: f.id, contactUserId: fx.userIds.vendor, message: "", dueOn: null, machines: input.machines.map((m) => ({ name: m.name, values: m })) });
  return { projectId: fx.projectId, foundationId: f.id, revisionId, tag, input };
}

type RouteModule = Record<string, (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>>;

/** POSTs a measurement record (multipart) through the route handler, as the browser does. */
export async function postMeasurement(cookie: string | null, c: Pick<CommissioningFoundation, "projectId" | "foundationId" | "revisionId">, file: Buffer, fileName: string, fields: Record<string, string>): Promise<Response> {
  const mod = (await import("@/app/api/v1/projects/[projectId]/foundations/[foundationId]/revisions/[revisionId]/measurements/route")) as unknown as RouteModule;
  const handler = mod.POST;
  if (!handler) throw new Error("the measurements route has no POST");
  return handler(uploadRequest(cookie, file, fileName, fields), { params: Promise.resolve({ projectId: c.projectId, foundationId: c.foundationId, revisionId: c.revisionId }) });
}

/** The fields of an ordinary record; override what a test is about. */
export function recordFields(over: Record<string, string> = {}): Record<string, string> {
  return {
    measuredOn: new Date().toISOString().slice(0, 10),
    measuredBy: "Field technician (test)",
    instrument: "Portable vibration analyser, serial T-1",
    instrumentCalibratedOn: "2026-01-15",
    speedRpm: "1785",
    load: "100 %",
    kind: "readings",
    ...over,
  };
}
