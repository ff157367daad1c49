import { DEMO_PASSWORD } from "@/modules/platform/demo";
import {
  acceptInvitationAction,
  forgotPasswordAction,
  resetPasswordAction,
  signInAction,
  signOutAction,
} from "@/app/(auth)/actions";
import {
  createFoundationAction,
  createProjectAction,
  inviteMemberAction,
  removeMemberAction,
  setUnitsPreferenceAction,
  updateProjectSettingsAction,
} from "@/app/(desk)/actions";
import type { ActionCase, RouteCase } from "../support/matrix-types";
import type { MatrixRole } from "../support/fixture";

const everyone: MatrixRole[] = ["anonymous", "outsider", "admin", "manager", "designer", "checker", "vendor", "viewer"];
const signedIn: MatrixRole[] = ["outsider", "admin", "manager", "designer", "checker", "vendor", "viewer"];
let seq = 0;
const unique = (prefix: string) => `${prefix}${Date.now().toString(36)}${(seq += 1)}`;

export const routeCases: RouteCase[] = [
  { route: "health", method: "GET", allowed: everyone, request: async () => ({ params: {} }) },
  { route: "v1/session", method: "GET", allowed: signedIn, request: async () => ({ params: {} }) },
  {
    route: "v1/session",
    method: "POST",
    allowed: everyone,
    request: async () => ({ params: {}, body: { email: "outsider@elsewhere.test", password: DEMO_PASSWORD } }),
  },
  // Signing out ends the caller's session: the matrix runs it last (see role-matrix.test.ts).
  { route: "v1/session", method: "DELETE", allowed: signedIn, request: async () => ({ params: {} }), freshSession: true },
  { route: "v1/projects", method: "GET", allowed: signedIn, request: async () => ({ params: {} }) },
  {
    route: "v1/projects",
    method: "POST",
    // Only accounts allowed to create projects (administrators, managers).
    allowed: ["admin", "manager"],
    request: async () => ({ params: {}, body: { code: unique("T-"), name: "Matrix project", client: "", site: "", units: "si" } }),
  },
  {
    route: "v1/projects/[projectId]",
    method: "GET",
    allowed: ["manager", "designer", "checker", "viewer"],
    request: async (fx) => ({ params: { projectId: fx.projectId } }),
  },
  {
    route: "v1/projects/[projectId]",
    method: "PATCH",
    allowed: ["manager"],
    // Writes back the settings the demo project already has (SI units, letters).
    request: async (fx) => ({ params: { projectId: fx.projectId }, body: { units: "si", revisionScheme: "letters" } }),
  },
  {
    route: "v1/projects/[projectId]/members",
    method: "GET",
    allowed: ["manager", "designer", "checker"],
    request: async (fx) => ({ params: { projectId: fx.projectId } }),
  },
  {
    route: "v1/projects/[projectId]/members",
    method: "POST",
    allowed: ["manager"],
    request: async (fx) => ({
      params: { projectId: fx.projectId },
      body: { projectId: fx.projectId, email: `${unique("inv")}@example.test`, name: "Matrix Invitee", role: "viewer" },
    }),
  },
  {
    route: "v1/projects/[projectId]/members/[memberId]",
    method: "DELETE",
    allowed: ["manager"],
    request: async (fx) => ({ params: { projectId: fx.projectId, memberId: await fx.createThrowawayMember() } }),
  },
  {
    route: "v1/projects/[projectId]/foundations",
    method: "GET",
    allowed: ["manager", "designer", "checker", "viewer"],
    request: async (fx) => ({ params: { projectId: fx.projectId } }),
  },
  {
    route: "v1/projects/[projectId]/foundations",
    method: "POST",
    allowed: ["manager", "designer"],
    request: async (fx) => ({ params: { projectId: fx.projectId }, body: { tag: unique("MX-"), machineTrain: "Matrix fan", location: "" } }),
  },
  { route: "v1/admin/outbox", method: "GET", allowed: ["admin"], request: async () => ({ params: {} }) },
];

export const actionCases: ActionCase[] = [
  {
    name: "auth.signIn",
    action: signInAction,
    allowed: everyone,
    fields: async () => ({ email: "outsider@elsewhere.test", password: DEMO_PASSWORD }),
  },
  { name: "auth.forgotPassword", action: forgotPasswordAction, allowed: everyone, fields: async () => ({ email: "nobody-here@example.test" }) },
  {
    name: "auth.resetPassword",
    action: resetPasswordAction,
    allowed: everyone,
    fields: async () => ({ token: "not-a-real-token-xxxxxxxx", password: "a-long-password-1", confirm: "a-long-password-1" }),
  },
  {
    name: "auth.acceptInvitation",
    action: acceptInvitationAction,
    allowed: everyone,
    fields: async () => ({ token: "not-a-real-token-xxxxxxxx", name: "X", password: "a-long-password-1", confirm: "a-long-password-1" }),
  },
  { name: "auth.signOut", action: signOutAction, allowed: signedIn, fields: async () => ({}), freshSession: true },
  {
    name: "project.create",
    action: createProjectAction,
    allowed: ["admin", "manager"],
    fields: async () => ({ code: unique("A-"), name: "Action project", units: "si" }),
  },
  {
    name: "members.invite",
    action: inviteMemberAction,
    allowed: ["manager"],
    fields: async (fx) => ({ projectId: fx.projectId, email: `${unique("ainv")}@example.test`, name: "Action Invitee", role: "checker" }),
  },
  {
    name: "members.remove",
    action: removeMemberAction,
    allowed: ["manager"],
    fields: async (fx) => ({ projectId: fx.projectId, memberId: await fx.createThrowawayMember() }),
  },
  { name: "account.setUnits", action: setUnitsPreferenceAction, allowed: signedIn, fields: async () => ({ units: "si" }) },
  {
    name: "project.updateSettings",
    action: updateProjectSettingsAction,
    allowed: ["manager"],
    fields: async (fx) => ({ projectId: fx.projectId, units: "si", revisionScheme: "letters" }),
  },
  {
    name: "foundation.create",
    action: createFoundationAction,
    allowed: ["manager", "designer"],
    fields: async (fx) => ({ projectId: fx.projectId, tag: unique("AF-"), machineTrain: "Action pump" }),
  },
];
