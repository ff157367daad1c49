"use server";

import { z } from "zod";
import { AppError } from "@/modules/platform/errors";
import { setUnitsPreference } from "@/db/queries/accounts";
import {
  createFoundationSchema,
  createProjectSchema,
  restoreFoundationSchema,
  withdrawFoundationSchema,
  inviteMemberSchema,
  removeMemberSchema,
} from "@/modules/platform/account-schemas";
import { projectSettingsFormSchema, settingsFromForm } from "@/modules/desk/project-settings";
import { createFoundation, createProject, getProjectByCode, removeMember, updateProjectSettings } from "@/db/queries/projects";
import { recordAuditEvent } from "@/db/queries/audit";
import { setFoundationWithdrawn } from "@/db/queries/foundations";
import { isUniqueViolation } from "@/db/queries/errors";
import { defineAction } from "../_lib/action";
import { inviteMember } from "../_lib/accounts-service";

export const createProjectAction = defineAction({
  name: "project.create",
  access: { kind: "signedIn" },
  schema: createProjectSchema,
  handler: async (ctx, input) => {
    const auth = ctx.auth;
    if (!auth || !(auth.user.isAdmin || auth.user.mayCreateProjects)) throw new AppError("forbidden", "Your account may not create projects.");
    if (await getProjectByCode(input.code)) throw new AppError("invalid_input", undefined, [{ path: "code", message: "A project with this code exists" }]);
    const project = await createProject(auth.actor, input);
    await recordAuditEvent({ projectId: project.id, actorId: auth.user.id, action: "project.created", detail: { code: project.code } });
    return { projectId: project.id };
  },
  redirectTo: (d) => `/projects/${d.projectId}`,
});

export const inviteMemberAction = defineAction({
  name: "members.invite",
  access: { kind: "project", permission: "members.manage" },
  schema: inviteMemberSchema,
  projectId: (i) => i.projectId,
  revalidate: (_d, i) => [`/projects/${i.projectId}/members`],
  handler: async (ctx, input) => {
    if (!ctx.auth) throw new AppError("unauthenticated");
    const r = await inviteMember(ctx.auth.actor, input);
    return { ...r, message: `Invitation sent to ${input.email}.` };
  },
});

export const removeMemberAction = defineAction({
  name: "members.remove",
  access: { kind: "project", permission: "members.manage" },
  schema: removeMemberSchema,
  projectId: (i) => i.projectId,
  revalidate: (_d, i) => [`/projects/${i.projectId}/members`],
  handler: async (ctx, input) => {
    // removeMember applies the last-manager rule (the same one as a role change by re-invitation).
    const member = await removeMember(input.projectId, input.memberId);
    if (!member) throw new AppError("not_found", "That member is not on this project.");
    await recordAuditEvent({ projectId: input.projectId, actorId: ctx.auth?.user.id, action: "member.removed", detail: { userId: member.userId } });
    return { removed: input.memberId };
  },
});

export const createFoundationAction = defineAction({
  name: "foundation.create",
  access: { kind: "project", permission: "foundation.create" },
  schema: createFoundationSchema,
  projectId: (i) => i.projectId,
  revalidate: (_d, i) => [`/projects/${i.projectId}`],
  handler: async (ctx, input) => {
    if (!ctx.auth) throw new AppError("unauthenticated");
    const { projectId, ...rest } = input;
    try {
      const f = await createFoundation(ctx.auth.actor, projectId, rest);
      await recordAuditEvent({ projectId, actorId: ctx.auth.user.id, action: "foundation.created", detail: { tag: f.tag } });
      return { foundationId: f.id };
    } catch (e) {
      if (isUniqueViolation(e, "foundations_project_tag_uq")) {
        throw new AppError("invalid_input", undefined, [{ path: "tag", message: "This tag is already used in the project" }]);
      }
      throw e;
    }
  },
});

export const updateProjectSettingsAction = defineAction({
  name: "project.updateSettings",
  access: { kind: "project", permission: "project.update" },
  schema: projectSettingsFormSchema,
  projectId: (i) => i.projectId,
  handler: async (ctx, input) => {
    if (!ctx.auth) throw new AppError("unauthenticated");
    const settings = settingsFromForm(input);
    const project = await updateProjectSettings(ctx.auth.actor, input.projectId, settings);
    if (!project) throw new AppError("forbidden");
    await recordAuditEvent({ projectId: input.projectId, actorId: ctx.auth.user.id, action: "project.settings-changed", detail: { ...settings } });
    return { saved: true };
  },
});

export const setUnitsPreferenceAction = defineAction({
  name: "account.setUnits",
  access: { kind: "signedIn" },
  schema: z.object({ units: z.enum(["si", "us"], "Pick SI or US customary") }),
  handler: async (ctx, input) => {
    if (!ctx.auth) throw new AppError("unauthenticated");
    await setUnitsPreference(ctx.auth.user.id, input.units);
    return { units: input.units };
  },
});

export const withdrawFoundationAction = defineAction({
  name: "foundation.withdraw",
  access: { kind: "project", permission: "foundation.withdraw" },
  schema: withdrawFoundationSchema,
  projectId: (i) => i.projectId,
  revalidate: (_d, i) => [`/projects/${i.projectId}`],
  handler: async (ctx, input) => {
    if (!ctx.auth) throw new AppError("unauthenticated");
    const f = await setFoundationWithdrawn(ctx.auth.actor, input.projectId, input.foundationId, { withdrawn: true, reason: input.reason });
    return { foundationId: f.id, projectId: input.projectId, message: `${f.tag} is withdrawn.` };
  },
  redirectTo: (d: { projectId: string }) => `/projects/${d.projectId}`,
});

export const restoreFoundationAction = defineAction({
  name: "foundation.restore",
  access: { kind: "project", permission: "foundation.withdraw" },
  schema: restoreFoundationSchema,
  projectId: (i) => i.projectId,
  revalidate: (_d, i) => [`/projects/${i.projectId}`],
  handler: async (ctx, input) => {
    if (!ctx.auth) throw new AppError("unauthenticated");
    const f = await setFoundationWithdrawn(ctx.auth.actor, input.projectId, input.foundationId, { withdrawn: false, reason: "" });
    return { foundationId: f.id, message: `${f.tag} is restored.` };
  },
});
