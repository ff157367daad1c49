"use server";

import { AppError } from "@/modules/platform/errors";
import { resolveCommentSchema, revisionCommentSchema, revisionDecisionSchema, revisionIssueSchema } from "@/modules/revisions";
import { z } from "zod";
import { defineAction } from "@/app/_lib/action";
import { commentOnRevision, decideOnRevision, issueForCheck, resolveRevisionComment, revisionPath, shareRevisionWithClient } from "./revision-service";

// Pages whose server-rendered data a revision command changes: the revision, the
// foundation's revisions, the workspace (its revision bar) and the project page.
const touched = (i: { projectId: string; foundationId: string; revisionId?: string }): string[] => [
  ...(i.revisionId ? [revisionPath(i.projectId, i.foundationId, i.revisionId)] : []),
  revisionPath(i.projectId, i.foundationId),
  `/projects/${i.projectId}/foundations/${i.foundationId}`,
  `/projects/${i.projectId}`,
];

export const issueRevisionAction = defineAction({
  name: "revision.issue",
  access: { kind: "project", permission: "revision.issue" },
  schema: revisionIssueSchema,
  projectId: (i) => i.projectId,
  handler: async (ctx, input) => {
    if (!ctx.auth) throw new AppError("unauthenticated");
    const rev = await issueForCheck(ctx.auth.actor, input);
    return { revisionId: rev.id, label: rev.label, path: revisionPath(input.projectId, input.foundationId, rev.id) };
  },
  revalidate: (_d, i) => touched(i),
  redirectTo: (d) => d.path,
});

export const decideRevisionAction = defineAction({
  name: "revision.decide",
  access: { kind: "project", permission: "revision.decide" },
  schema: revisionDecisionSchema,
  projectId: (i) => i.projectId,
  handler: async (ctx, input) => {
    if (!ctx.auth) throw new AppError("unauthenticated");
    const rev = await decideOnRevision(ctx.auth.actor, input);
    return { revisionId: rev.id, status: rev.status, message: rev.status === "approved" ? `Revision ${rev.label} approved.` : rev.status === "checked" ? `Revision ${rev.label} checked; it awaits approval by someone else.` : `Revision ${rev.label} returned with comments.` };
  },
  revalidate: (_d, i) => touched(i),
});

export const commentOnRevisionAction = defineAction({
  name: "revision.comment",
  access: { kind: "project", permission: "revision.comment" },
  schema: revisionCommentSchema,
  projectId: (i) => i.projectId,
  handler: async (ctx, input) => {
    if (!ctx.auth) throw new AppError("unauthenticated");
    const c = await commentOnRevision(ctx.auth.actor, input);
    return { commentId: c.id, message: c.parentId ? "Answer posted." : "Comment posted." };
  },
  revalidate: (_d, i) => touched(i),
});

export const resolveRevisionCommentAction = defineAction({
  name: "revision.resolveComment",
  access: { kind: "project", permission: "revision.comment" },
  schema: resolveCommentSchema,
  projectId: (i) => i.projectId,
  handler: async (ctx, input) => {
    if (!ctx.auth) throw new AppError("unauthenticated");
    const c = await resolveRevisionComment(ctx.auth.actor, input);
    return { commentId: c.id, revisionId: c.revisionId, resolved: c.resolved, message: c.resolved ? "Marked resolved." : "Opened again." };
  },
  revalidate: (d, i) => touched({ ...i, revisionId: d.revisionId }),
});

const uuidField = (what: string) => z.string({ error: `${what} is required` }).uuid({ error: `${what} must be an id` });

export const shareRevisionAction = defineAction({
  name: "revision.share",
  access: { kind: "project", permission: "revision.share" },
  schema: z.object({
    projectId: uuidField("projectId"),
    foundationId: uuidField("foundationId"),
    revisionId: uuidField("revisionId"),
    shared: z.enum(["true", "false"], { error: "shared must be true or false" }).transform((v) => v === "true"),
  }),
  projectId: (i) => i.projectId,
  handler: async (ctx, input) => {
    if (!ctx.auth) throw new AppError("unauthenticated");
    const rev = await shareRevisionWithClient(ctx.auth.actor, input);
    return { revisionId: rev.id, shared: rev.sharedWithClient !== null, message: rev.sharedWithClient ? `Revision ${rev.label} shared with the client.` : `Revision ${rev.label} no longer shared with the client.` };
  },
  revalidate: (_d, i) => touched(i),
});
