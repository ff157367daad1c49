import bcrypt from "bcryptjs";
import { randomUUID } from "node:crypto";
import { readFileSync } from "node:fs";
import path from "node:path";
import { parseAnalysisInput } from "@/modules/calc";
import type { MachineInput } from "@/modules/calc/schema";
import { createDraftFromExample, getDraft } from "./queries/drafts";
import { createSeedRevision } from "./queries/revisions";
import { DEMO_PASSWORD, DEMO_PROJECT_CODE, DEMO_VENDOR_COMPANY, demoAccounts } from "@/modules/platform/demo";
import { createUser, getUserByEmail } from "./queries/accounts";
import { createFoundation, createProject, getOrCreateCompany, getProjectByCode, upsertMember } from "./queries/projects";
import { createDemoVendorHistory } from "./queries/vendor-demo";
import { buildRequestWorkbook } from "@/modules/vendor-data/workbook-build";

/** Creates the demo scenario unless its project already exists. */
export async function seedDemo(): Promise<{ created: boolean; projectId: string }> {
  const existing = await getProjectByCode(DEMO_PROJECT_CODE);
  if (existing) return { created: false, projectId: existing.id };
  const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
  const ids = new Map<string, string>();
  for (const a of demoAccounts) {
    const found = await getUserByEmail(a.email);
    const user =
      found ??
      (await createUser({
        email: a.email,
        name: a.name,
        passwordHash: hash,
        isAdmin: a.role === "admin",
        mayCreateProjects: a.role === "admin" || a.role === "manager",
      }));
    ids.set(a.role, user.id);
  }
  const managerId = ids.get("manager");
  if (!managerId) throw new Error("demo manager missing");
  const actor = { userId: managerId, isAdmin: false };
  const project = await createProject(actor, {
    code: DEMO_PROJECT_CODE,
    name: "Kestrel Bay Reclamation Works: Pump House 1",
    client: "Kestrel Bay Water Board (invented)",
    site: "Kestrel Bay, east terrace",
    units: "si",
  });
  const companyId = await getOrCreateCompany(DEMO_VENDOR_COMPANY);
  for (const role of ["designer", "checker", "vendor", "viewer"] as const) {
    const userId = ids.get(role);
    if (userId) await upsertMember({ projectId: project.id, userId, role, companyId: role === "vendor" ? companyId : null });
  }
  const pump = await createFoundation(actor, project.id, { tag: "PH1-P101", machineTrain: "Raw-water pump train (motor + pump)", location: "Pump house bay 1" });
  const blower = await createFoundation(actor, project.id, { tag: "PH1-B201", machineTrain: "Aeration blower", location: "Blower hall, grid C4" });
  const designerId = ids.get("designer") ?? null;
  const pumpInput = readExample("raw-water-pump-train.json");
  await createDraftFromExample(pump.id, pumpInput, designerId);
  await createDraftFromExample(blower.id, readExample("aeration-blower.json"), designerId);
  await seedVendorData(project, pump.id, companyId, pumpInput.machines, ids);
  const checkerId = ids.get("checker");
  if (designerId && checkerId) await seedPumpRevisions(project.id, pump.id, pumpInput, designerId, checkerId);
  return { created: true, projectId: project.id };
}

const PUMP = "Raw-water pump RWP-101";
const IMPELLER_PATH = `machines["${PUMP}"].rotors["impeller"].mass`;

/**
 * PH1-P101's review so far: revision A on the vendor's preliminary impeller mass
 * (950 kg), returned by the checker with comments; revision B on the certified
 * 1100 kg (the example as it stands, so the draft equals B), now in check.
 */
async function seedPumpRevisions(projectId: string, foundationId: string, input: ReturnType<typeof readExample>, designerId: string, checkerId: string): Promise<void> {
  const preliminary = structuredClone(input);
  const impeller = preliminary.machines.find((m) => m.name === PUMP)?.rotors.find((r) => r.name === "impeller");
  if (!impeller) throw new Error("the pump example has no impeller");
  impeller.mass = 950;
  const day = 86_400_000;
  const now = Date.now();
  await createSeedRevision({
    projectId,
    foundationId,
    input: preliminary,
    issuedById: designerId,
    issuedAt: new Date(now - 12 * day),
    editorIds: [designerId],
    note: "First issue, on the vendor's preliminary machine data (impeller 950 kg), to start the check while the certified drawing is awaited.",
    comments: [
      {
        fieldPath: IMPELLER_PATH,
        body: "The impeller mass is the vendor's preliminary 950 kg; their certified drawing is due. Please reissue on the certified figure.",
        authorId: checkerId,
        resolved: true,
        answer: { body: "Agreed. Corvane's certified drawing gives 1100 kg; revision B uses it.", authorId: designerId },
      },
      {
        fieldPath: "massProperties.massRatio",
        body: "Block-to-machine mass ratio 2.92 is under the 3.0 minimum. Enlarge the mat or justify the lower ratio.",
        authorId: checkerId,
      },
    ],
    decision: { outcome: "returned", note: "Returned: preliminary rotor data and the mass ratio check fails.", decidedById: checkerId, decidedByRole: "checker", decidedAt: new Date(now - 10 * day) },
  });
  // B was issued from the draft as it stands, so it records the vendor submission the draft uses.
  const draft = await getDraft({ userId: designerId, isAdmin: false }, projectId, foundationId);
  await createSeedRevision({ projectId, foundationId, input, issuedById: designerId, issuedAt: new Date(now - 3 * day), editorIds: [designerId], note: "Impeller mass set to the vendor's certified 1100 kg (certified drawing received); answers the checker's comment on revision A.", vendorSubmissionId: draft?.vendorSubmissionId ?? null });
}

/** An example input from examples/, checked by the contract's schema like any other input. */
function readExample(file: string) {
  const parsed = parseAnalysisInput(JSON.parse(readFileSync(path.join(process.cwd(), "examples", file), "utf8")));
  if (!parsed.ok) throw new Error(`examples/${file} is not a valid analysis input: ${parsed.issues.map((i) => `${i.path}: ${i.message}`).join("; ")}`);
  return parsed.input;
}

/**
 * The pump train's data request to Corvane Pumps: version 1 with a preliminary impeller
 * mass (950 kg, as revision A used), version 2 with the certified 1100 kg of examples/raw-water-pump-train.json
 * uploaded as the request's own workbook, both accepted; the seeded draft holds version 2.
 */
async function seedVendorData(project: { id: string; code: string; name: string }, foundationId: string, companyId: string, machines: MachineInput[], ids: Map<string, string>) {
  const vendorUserId = ids.get("vendor");
  const designerUserId = ids.get("designer");
  if (!vendorUserId || !designerUserId) throw new Error("demo vendor or designer missing");
  const first = machines.map((m) => ({ ...m, rotors: m.rotors.map((r) => (r.name === "impeller" ? { ...r, mass: 950 } : r)) }));
  const requestId = randomUUID();
  const workbook = await buildRequestWorkbook({
    requestId,
    projectCode: project.code,
    projectName: project.name,
    foundationTag: "PH1-P101",
    machineTrain: "Raw-water pump train (motor + pump)",
    companyName: DEMO_VENDOR_COMPANY,
    dueOn: null,
    message: "",
    machines: machines.map((m) => ({ name: m.name, values: m })),
  });
  await createDemoVendorHistory({
    requestId,
    projectId: project.id,
    foundationId,
    companyId,
    vendorUserId,
    designerUserId,
    requested: first.map((m) => ({ name: m.name, values: m })),
    first,
    second: { machines, workbook, fileName: "PH1-P101 machine data (certified).xlsx" },
  });
}
