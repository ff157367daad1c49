import { listFoundationsWithDrafts } from "@/db/queries/drafts";
import { getProjectForMember } from "@/db/queries/projects";
import { getRevision, getUserContact, listFoundationRevisionStates, listRevisions } from "@/db/queries/revisions";
import { defineRoute } from "@/app/_lib/route";
import { listLatestMeasurements } from "@/db/queries/commissioning";
import { soilFlagText } from "@/modules/desk/measurement-format";
import { recordVerdictText, storedCalibration } from "@/modules/desk/measurement-view";
import { AppError } from "@/modules/platform/errors";
import { canonicalInputHash, isApprovalStale } from "@/modules/revisions";
import { attachmentDisposition, registerFileName, registerWorkbookBytes, XLSX_CONTENT_TYPE, type RegisterRow } from "@/modules/calc-package";

export const dynamic = "force-dynamic";

// The project register (an .xlsx download) for managers: every foundation, its latest
// revision as issued, status, governing check and flags.
export const GET = defineRoute({
  access: { kind: "project", permission: "register.export" },
  projectId: (p: { projectId: string }) => p.projectId,
  handler: async ({ auth, params }) => {
    const actor = auth!.actor;
    const project = await getProjectForMember(actor, params.projectId);
    if (!project) throw new AppError("not_found");
    const [foundations, states, me, latestSite] = await Promise.all([
      listFoundationsWithDrafts(actor, project.id),
      listFoundationRevisionStates(actor, project.id),
      getUserContact(actor.userId),
      listLatestMeasurements(project.id),
    ]);
    const stateOf = new Map(states.map((s) => [s.foundationId, s]));
    const siteOf = new Map(latestSite.map((m) => [m.foundationId, m]));
    const rows: RegisterRow[] = [];
    for (const f of foundations) {
      const state = stateOf.get(f.id);
      const latest = state?.latest ? await getRevision(actor, project.id, f.id, state.latest.id) : undefined;
      const approved = state?.latestApproved ? (state.latestApproved.id === latest?.id ? latest : (await listRevisions(actor, project.id, f.id)).find((r) => r.id === state.latestApproved?.id)) : undefined;
      const flags: string[] = [];
      if (state?.latest && isApprovalStale(state.latest, state.draftVendorSubmissionId)) flags.push("vendor data changed since approval");
      if (latest && f.input && canonicalInputHash(f.input) !== latest.inputHash) flags.push("draft differs from the latest revision");
      if (f.soilFlag) flags.push(soilFlagText(f.soilFlag, project.units));
      const site = siteOf.get(f.id);
      rows.push({
        tag: f.tag,
        machineTrain: f.machineTrain,
        location: f.location,
        draftState: f.input ? `draft v${f.draftVersion}, not issued` : f.incomplete ? `draft v${f.draftVersion}, incomplete, not issued` : "not started",
        latest: latest ? { ...latest, result: latest.result } : null,
        latestApproved: approved ? { label: approved.label, approvedAt: approved.decision?.decidedAt ?? null } : null,
        revisionCount: state?.revisionCount ?? 0,
        flags,
        site: site ? { measuredOn: site.measuredOn, revisionLabel: site.revisionLabel, verdict: recordVerdictText(site.verdicts), fittedShearModulus: storedCalibration(site.calibration)?.fittedShearModulus ?? null } : null,
      });
    }
    const now = new Date();
    const bytes = await registerWorkbookBytes({
      project: { code: project.code, name: project.name, client: project.client, site: project.site, units: project.units },
      rows,
      generatedAt: now,
      generatedByName: me?.name ?? "",
    });
    return new Response(new Uint8Array(bytes), {
      headers: {
        "content-type": XLSX_CONTENT_TYPE,
        "content-length": String(bytes.length),
        "content-disposition": attachmentDisposition(registerFileName(project.code, now)),
        "cache-control": "private, no-store",
        "x-content-type-options": "nosniff",
      },
    });
  },
});
