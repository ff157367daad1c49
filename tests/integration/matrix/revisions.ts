// Role-matrix rows for the revision routes and actions. They run against a foundation
// of their own (ZZ-MATRIX-REV, one revision returned by the checker, one comment), so
// an allowed call gets through the guard without changing the demo's revisions:
// issuing meets "identical to the latest revision" and deciding meets "already
// decided" (both 409, past the guard); comments and resolutions are real.
import { createDraftFromExample } from "@/db/queries/drafts";
import { createFoundation, listFoundations } from "@/db/queries/projects";
import { createRevisionComment, decideRevision, issueRevision, listRevisionComments, listRevisions } from "@/db/queries/revisions";
import { parseAnalysisInput } from "@/modules/calc";
import { permissionMap } from "@/modules/platform/permissions";
import { commentOnRevisionAction, decideRevisionAction, issueRevisionAction, resolveRevisionCommentAction, shareRevisionAction } from "@/app/(desk)/projects/[projectId]/foundations/[foundationId]/revisions/actions";
import type { Fixture } from "../support/fixture";
import type { ActionCase, RouteCase } from "../support/matrix-types";
import { sampleAnalysisInput } from "../analysis-input-sample";

const TAG = "ZZ-MATRIX-REV";

interface Target {
  projectId: string;
  foundationId: string;
  revisionId: string;
  commentId: string;
}

let target: Promise<Target> | undefined;

async function setUp(fx: Fixture): Promise<Target> {
  const manager = { userId: fx.userIds.manager, isAdmin: false };
  const designer = { userId: fx.userIds.designer, isAdmin: false };
  const checker = { userId: fx.userIds.checker, isAdmin: false };
  const existing = (await listFoundations(manager, fx.projectId)).find((f) => f.tag === TAG);
  const foundation = existing ?? (await createFoundation(manager, fx.projectId, { tag: TAG, machineTrain: "Role-matrix rows", location: "" }));
  const parsed = parseAnalysisInput(sampleAnalysisInput());
  if (!parsed.ok) throw new Error("the sample input is not valid");
  await createDraftFromExample(foundation.id, parsed.input, fx.userIds.designer);
  let revision = (await listRevisions(manager, fx.projectId, foundation.id)).at(-1);
  if (!revision) {
    const issued = await issueRevision(designer, fx.projectId, foundation.id);
    if (!issued.ok) throw new Error(`matrix revision not issued: ${issued.reason}`);
    revision = issued.revision;
  }
  if (!revision.decision) await decideRevision(checker, fx.projectId, foundation.id, revision.id, { outcome: "returned", note: "matrix" });
  let comment = (await listRevisionComments(manager, fx.projectId, foundation.id, revision.id))?.find((c) => !c.parentId);
  if (!comment) {
    const made = await createRevisionComment(checker, fx.projectId, foundation.id, revision.id, { body: "matrix comment", fieldPath: null, parentId: null });
    if (!made.ok) throw new Error(`matrix comment not created: ${made.reason}`);
    comment = made.comment;
  }
  return { projectId: fx.projectId, foundationId: foundation.id, revisionId: revision.id, commentId: comment.id };
}

function targetOf(fx: Fixture): Promise<Target> {
  target ??= setUp(fx);
  return target;
}

const base = "v1/projects/[projectId]/foundations/[foundationId]/revisions";
const foundationParams = async (fx: Fixture) => {
  const t = await targetOf(fx);
  return { projectId: t.projectId, foundationId: t.foundationId };
};
const revisionParams = async (fx: Fixture) => {
  const t = await targetOf(fx);
  return { projectId: t.projectId, foundationId: t.foundationId, revisionId: t.revisionId };
};

export const routeCases: RouteCase[] = [
  { route: base, method: "GET", allowed: [...permissionMap["revision.read"]], request: async (fx) => ({ params: await foundationParams(fx) }) },
  { route: base, method: "POST", allowed: [...permissionMap["revision.issue"]], request: async (fx) => ({ params: await foundationParams(fx), body: { note: "Issued for check." } }) },
  { route: base, method: "POST", allowed: [...permissionMap["revision.issue"]], request: async (fx) => ({ params: await foundationParams(fx), body: { note: "Issued for construction.", purpose: "issued-for-construction" } }) },
  // Without from/to an allowed caller gets 400 (past the guard); the comparison itself is in revisions.test.ts.
  { route: `${base}/compare`, method: "GET", allowed: [...permissionMap["revision.read"]], request: async (fx) => ({ params: await foundationParams(fx) }) },
  { route: `${base}/[revisionId]`, method: "GET", allowed: [...permissionMap["revision.read"]], request: async (fx) => ({ params: await revisionParams(fx) }) },
  {
    route: `${base}/[revisionId]/decision`,
    method: "POST",
    allowed: [...permissionMap["revision.decide"]],
    request: async (fx) => ({ params: await revisionParams(fx), body: { outcome: "approved", note: "" } }),
  },
  // The first signature of a two-step sign-off: the same permission; in the demo's one-step
  // project an allowed caller meets 400 (outcome refused), past the guard.
  {
    route: `${base}/[revisionId]/decision`,
    method: "POST",
    allowed: [...permissionMap["revision.decide"]],
    request: async (fx) => ({ params: await revisionParams(fx), body: { outcome: "checked", note: "" } }),
  },
  // Review comments are internal: the client (viewer) is refused (issue 18, item 5).
  { route: `${base}/[revisionId]/comments`, method: "GET", allowed: [...permissionMap["revision.commentsRead"]], request: async (fx) => ({ params: await revisionParams(fx) }) },
  // Sharing a revision's package with the client: managers only (left shared, then withdrawn).
  { route: `${base}/[revisionId]/share`, method: "POST", allowed: [...permissionMap["revision.share"]], request: async (fx) => ({ params: await revisionParams(fx) }) },
  { route: `${base}/[revisionId]/share`, method: "DELETE", allowed: [...permissionMap["revision.share"]], request: async (fx) => ({ params: await revisionParams(fx) }) },
  {
    route: `${base}/[revisionId]/comments`,
    method: "POST",
    allowed: [...permissionMap["revision.comment"]],
    request: async (fx, role) => ({ params: await revisionParams(fx), body: { body: `matrix: ${role} comments` } }),
  },
  {
    route: `${base}/[revisionId]/comments/[commentId]`,
    method: "PATCH",
    allowed: [...permissionMap["revision.comment"]],
    request: async (fx) => {
      const t = await targetOf(fx);
      return { params: { projectId: t.projectId, foundationId: t.foundationId, revisionId: t.revisionId, commentId: t.commentId }, body: { resolved: false } };
    },
  },
];

export const actionCases: ActionCase[] = [
  {
    name: "revision.issue",
    action: issueRevisionAction,
    allowed: [...permissionMap["revision.issue"]],
    fields: async (fx) => ({ ...(await foundationParams(fx)), note: "Issued for check." }),
  },
  {
    name: "revision.decide",
    action: decideRevisionAction,
    allowed: [...permissionMap["revision.decide"]],
    fields: async (fx) => ({ ...(await revisionParams(fx)), outcome: "approved", note: "" }),
  },
  {
    name: "revision.decide",
    action: decideRevisionAction,
    allowed: [...permissionMap["revision.decide"]],
    fields: async (fx) => ({ ...(await revisionParams(fx)), outcome: "checked", note: "" }),
  },
  {
    name: "revision.comment",
    action: commentOnRevisionAction,
    allowed: [...permissionMap["revision.comment"]],
    fields: async (fx, role) => ({ ...(await revisionParams(fx)), body: `matrix: ${role} comments`, fieldPath: "soil.poissonRatio" }),
  },
  {
    name: "revision.share",
    action: shareRevisionAction,
    allowed: [...permissionMap["revision.share"]],
    fields: async (fx) => ({ ...(await revisionParams(fx)), shared: "false" }),
  },
  {
    name: "revision.resolveComment",
    action: resolveRevisionCommentAction,
    allowed: [...permissionMap["revision.comment"]],
    fields: async (fx) => {
      const t = await targetOf(fx);
      return { projectId: t.projectId, foundationId: t.foundationId, commentId: t.commentId, resolved: "false" };
    },
  },
];
