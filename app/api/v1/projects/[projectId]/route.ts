import { AppError } from "@/modules/platform/errors";
import { z } from "zod";
import { getProjectForMember, updateProjectSettings } from "@/db/queries/projects";
import { recordAuditEvent } from "@/db/queries/audit";
import { defineRoute } from "../../../../_lib/route";

export const dynamic = "force-dynamic";

export const GET = defineRoute({
  access: { kind: "project", permission: "project.read" },
  projectId: (p: { projectId: string }) => p.projectId,
  handler: async ({ auth, params }) => {
    const project = await getProjectForMember(auth!.actor, params.projectId);
    if (!project) throw new AppError("not_found");
    return { project };
  },
});

const criteriaSchema = z.strictObject({
  frequencySeparation: z.number().gt(0).lt(1).optional(),
  maxDisplacementPeak: z.number().gt(0).max(0.01).optional(),
  maxVelocityPeak: z.number().gt(0).max(1).optional(),
  minMassRatio: z.number().gt(0).max(100).optional(),
  maxEccentricity: z.number().gt(0).max(1).optional(),
  maxBearingRatio: z.number().gt(0).max(1).optional(),
});

// Settings in SI with the contract's criterion keys; omitted parts keep their stored values.
const patchSchema = z.strictObject({
  units: z.enum(["si", "us"]).optional(),
  revisionScheme: z.enum(["letters", "numbers"]).optional(),
  paperSize: z.enum(["a4", "letter"]).optional(),
  signOffSteps: z.enum(["one", "two"], "signOffSteps must be \"one\" or \"two\"").optional(),
  criteriaDefaults: criteriaSchema.optional(),
  soilBand: z.strictObject({ lowerFactor: z.number().gt(0).max(1).optional(), upperFactor: z.number().min(1).max(10).optional() }).optional(),
});

export const PATCH = defineRoute({
  access: { kind: "project", permission: "project.update" },
  projectId: (p: { projectId: string }) => p.projectId,
  body: patchSchema,
  handler: async ({ auth, params }, body) => {
    const current = await getProjectForMember(auth!.actor, params.projectId);
    if (!current) throw new AppError("not_found");
    const settings = {
      units: body.units ?? current.units,
      revisionScheme: body.revisionScheme ?? current.revisionScheme,
      paperSize: body.paperSize ?? current.paperSize,
      signOffSteps: body.signOffSteps ?? current.signOffSteps,
      criteriaDefaults: body.criteriaDefaults ?? current.criteriaDefaults,
      soilBand: body.soilBand ?? current.soilBand,
    };
    const project = await updateProjectSettings(auth!.actor, params.projectId, settings);
    if (!project) throw new AppError("forbidden");
    await recordAuditEvent({ projectId: params.projectId, actorId: auth!.user.id, action: "project.settings-changed", detail: settings });
    return { project };
  },
});
