// Role-matrix rows for the calculation-package downloads (workbook and PDF) and the project
// register (managers only). The client (viewer) downloads an approved revision's package,
// or one a manager shared; never another unapproved one (issue 12 item 4, issue 18 item 5).
// Demo revision A of PH1-P101 is returned (unapproved); two foundations of their own carry
// an approved revision (ZZ-MATRIX-APPROVED) and a shared one in check (ZZ-MATRIX-SHARED).
import { createDraftFromExample } from "@/db/queries/drafts";
import { createFoundation, listFoundations } from "@/db/queries/projects";
import { decideRevision, issueRevision, listRevisions, setRevisionShared } from "@/db/queries/revisions";
import { parseAnalysisInput } from "@/modules/calc";
import { permissionMap } from "@/modules/platform/permissions";
import type { Fixture, MatrixRole } from "../support/fixture";
import type { RouteCase } from "../support/matrix-types";
import { sampleAnalysisInput } from "../analysis-input-sample";

const team = permissionMap["package.export"].filter((r) => r !== "viewer");

async function demoRevision(fx: Fixture): Promise<Record<string, string>> {
  const manager = { userId: fx.userIds.manager, isAdmin: false };
  const foundation = (await listFoundations(manager, fx.projectId)).find((f) => f.tag === "PH1-P101");
  if (!foundation) throw new Error("demo foundation PH1-P101 missing");
  const revision = (await listRevisions(manager, fx.projectId, foundation.id))[0];
  if (!revision) throw new Error("PH1-P101 has no revision");
  if (revision.decision?.outcome === "approved" || revision.sharedWithClient) throw new Error("PH1-P101 revision A should be unapproved and unshared");
  return { projectId: fx.projectId, foundationId: foundation.id, revisionId: revision.id };
}

const own = new Map<string, Promise<Record<string, string>>>();

/** A foundation of its own with one revision issued by the designer, then approved or shared. */
function ownRevision(fx: Fixture, tag: string, then: "approve" | "share"): Promise<Record<string, string>> {
  let p = own.get(tag);
  if (!p) {
    p = (async () => {
      const manager = { userId: fx.userIds.manager, isAdmin: false };
      const existing = (await listFoundations(manager, fx.projectId)).find((f) => f.tag === tag);
      const foundation = existing ?? (await createFoundation(manager, fx.projectId, { tag, machineTrain: "Role-matrix package rows", location: "" }));
      const parsed = parseAnalysisInput(sampleAnalysisInput());
      if (!parsed.ok) throw new Error("the sample input is not valid");
      await createDraftFromExample(foundation.id, parsed.input, fx.userIds.designer);
      let revision = (await listRevisions(manager, fx.projectId, foundation.id)).at(-1);
      if (!revision) {
        const issued = await issueRevision({ userId: fx.userIds.designer, isAdmin: false }, fx.projectId, foundation.id);
        if (!issued.ok) throw new Error(`matrix revision not issued: ${issued.reason}`);
        revision = issued.revision;
      }
      if (then === "approve" && !revision.decision) await decideRevision({ userId: fx.userIds.checker, isAdmin: false }, fx.projectId, foundation.id, revision.id, { outcome: "approved", note: "matrix" });
      if (then === "share") await setRevisionShared(manager, fx.projectId, foundation.id, revision.id, true);
      return { projectId: fx.projectId, foundationId: foundation.id, revisionId: revision.id };
    })();
    own.set(tag, p);
  }
  return p;
}

const packageRoute = "v1/projects/[projectId]/foundations/[foundationId]/revisions/[revisionId]/package";
const pdfRoute = `${packageRoute}/pdf`;
const rows = (route: string, withShared: boolean): RouteCase[] => [
  // Unapproved and not shared: the design team only; the viewer gets 403.
  { route, method: "GET", allowed: [...team] as MatrixRole[], request: async (fx) => ({ params: await demoRevision(fx) }) },
  // Approved: everyone but vendors, the viewer included.
  { route, method: "GET", allowed: [...permissionMap["package.export"]], request: async (fx) => ({ params: await ownRevision(fx, "ZZ-MATRIX-APPROVED", "approve") }) },
  // In check but shared with the client by a manager: the viewer too (the workbook; the PDF
  // goes through the same readPackageRows, and each PDF build costs seconds).
  ...(withShared
    ? [{ route, method: "GET" as const, allowed: [...permissionMap["package.export"]], request: async (fx: Fixture) => ({ params: await ownRevision(fx, "ZZ-MATRIX-SHARED", "share") }) }]
    : []),
];

export const routeCases: RouteCase[] = [
  ...rows(packageRoute, true),
  ...rows(pdfRoute, false),
  { route: "v1/projects/[projectId]/register", method: "GET", allowed: [...permissionMap["register.export"]], request: async (fx) => ({ params: { projectId: fx.projectId } }) },
];
