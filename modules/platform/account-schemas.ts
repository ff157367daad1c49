import { z } from "zod";
import { projectRoles } from "./permissions";

// The same schemas serve the forms' server actions and the API.
export const emailField = z.email("Enter a valid e-mail address").trim().toLowerCase().max(254);
export const newPasswordField = z
  .string()
  .min(10, "Use at least 10 characters")
  .max(200, "Use at most 200 characters");

export const signInSchema = z.object({
  email: emailField,
  password: z.string().min(1, "Enter your password").max(200),
  next: z.string().max(500).optional(),
});

export const forgotPasswordSchema = z.object({ email: emailField });

export const resetPasswordSchema = z
  .object({
    token: z.string().min(10).max(200),
    password: newPasswordField,
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two passwords differ" });

export const acceptInvitationSchema = z
  .object({
    token: z.string().min(10).max(200),
    name: z.string().trim().min(1, "Enter your name").max(120),
    password: newPasswordField,
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two passwords differ" });

export const inviteMemberSchema = z
  .object({
    projectId: z.uuid(),
    email: emailField,
    name: z.string().trim().min(1, "Enter a name").max(120),
    role: z.enum(projectRoles, "Pick a role"),
    company: z.string().trim().max(120).optional().default(""),
  })
  .refine((v) => v.role !== "vendor" || v.company.length > 0, { path: ["company"], message: "A vendor belongs to a company" });

export const removeMemberSchema = z.object({ projectId: z.uuid(), memberId: z.uuid() });

export const projectCodeField = z
  .string()
  .trim()
  .min(2, "At least 2 characters")
  .max(24, "At most 24 characters")
  .regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, "Letters, digits, dot, dash and underscore only");

export const createProjectSchema = z.object({
  code: projectCodeField,
  name: z.string().trim().min(1, "Enter a name").max(160),
  client: z.string().trim().max(160).default(""),
  site: z.string().trim().max(160).default(""),
  units: z.enum(["si", "us"], "Pick SI or US customary").default("si"),
});

/** Withdrawing a foundation says why (kept in the audit log); restoring needs no reason. */
export const withdrawFoundationSchema = z.object({
  projectId: z.uuid(),
  foundationId: z.uuid(),
  reason: z.string().trim().min(3, "Say why it is withdrawn (at least 3 characters)").max(500, "At most 500 characters"),
});
export const restoreFoundationSchema = z.object({ projectId: z.uuid(), foundationId: z.uuid() });

export const createFoundationSchema = z.object({
  projectId: z.uuid(),
  tag: z.string().trim().min(1, "Enter a tag").max(40),
  machineTrain: z.string().trim().max(160).default(""),
  location: z.string().trim().max(160).default(""),
});
