import { getFoundation } from "@/db/queries/foundations";
import { getProjectForMember, type Actor } from "@/db/queries/projects";
import { getPackageRevision, getRevision, getRevisionVendorSubmission, getUserContact, listRevisionCommentsWithResolution, listRevisionHistory, listRevisions } from "@/db/queries/revisions";
import { AppError } from "@/modules/platform/errors";
import type { RevisionPackageData } from "@/modules/calc-package";
import { packageMeasurementOf } from "@/modules/calc-package/measurements-sheet";
import { listRevisionMeasurementsForPackage } from "@/db/queries/commissioning";
import { idOf, revisionNotFound, type RevisionParams } from "../../revision-params";

/**
 * What the workbook and the PDF of one revision are built from. The light rows first: they
 * make the cache key, and the revision's stored result (about a megabyte with its sweep) is
 * read only by `load`, when a file is actually built. The queries scope by membership.
 */
export async function readPackageRows(actor: Actor, params: RevisionParams) {
  const foundationId = idOf(params.foundationId, "foundation");
  const revisionId = idOf(params.revisionId, "revision");
  // The client (viewer) gets approved revisions' packages, or one a manager shared; 403 otherwise.
  const access = await getPackageRevision(actor, params.projectId, foundationId, revisionId);
  if (!access.ok && access.reason === "not-found") throw revisionNotFound();
  if (!access.ok) {
    throw new AppError("forbidden", `Revision ${access.revision.label} is ${access.revision.status === "in-check" ? "in check" : access.revision.status}: the client receives approved packages only, unless a manager shares this one.`);
  }
  const [project, foundation, history, trail, me, measurements] = await Promise.all([
    getProjectForMember(actor, params.projectId),
    getFoundation(actor, params.projectId, foundationId),
    listRevisions(actor, params.projectId, foundationId),
    listRevisionHistory(actor, params.projectId, foundationId),
    getUserContact(actor.userId),
    // Site measurements (commissioning) of the revision: records of measured vibration, read by every package reader.
    listRevisionMeasurementsForPackage(revisionId),
  ]);
  const summary = history.find((r) => r.id === revisionId);
  if (!project || !foundation || !summary) throw revisionNotFound();
  const key = JSON.stringify([actor.userId, project.code, project.name, project.client, project.site, project.units, project.paperSize, project.updatedAt, foundation, revisionId, history, trail.length, measurements.map((m) => m.id)]);
  const load = async (): Promise<RevisionPackageData> => {
    const revision = await getRevision(actor, params.projectId, foundationId, revisionId);
    if (!revision) throw revisionNotFound();
    // The trail's comments and the vendor submission by name (comment and resolve events
    // lengthen the trail, so the key above changes with them).
    const [comments, submission] = await Promise.all([
      listRevisionCommentsWithResolution(actor, params.projectId, foundationId, revisionId),
      getRevisionVendorSubmission(actor, params.projectId, revision.vendorSubmissionId),
    ]);
    return {
      project: { code: project.code, name: project.name, client: project.client, site: project.site, units: project.units, paperSize: project.paperSize },
      foundation: { tag: foundation.tag, machineTrain: foundation.machineTrain, location: foundation.location },
      revision,
      input: revision.input,
      result: revision.result,
      history,
      trail,
      comments,
      vendorSubmission: submission
        ? { request: `request to ${submission.companyName} of ${submission.requestedAt.toISOString().slice(0, 10)}`, version: submission.version, fileName: submission.fileName, sha256: submission.sha256, submittedAt: submission.submittedAt }
        : null,
      measurements: measurements.map(packageMeasurementOf),
      generatedAt: new Date(),
      generatedByName: me?.name ?? "",
    };
  };
  return { project, foundation, summary, key, load };
}
