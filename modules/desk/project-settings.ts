// Project settings a manager keeps: display units, default criteria (used where a
// draft leaves a criterion blank), soil-band factors and the revision-label scheme.
import { z } from "zod";

const blankToUndefined = (v: unknown) => (typeof v === "string" && v.trim() === "" ? undefined : v);
const optionalNumber = (check: (n: z.ZodNumber) => z.ZodNumber) =>
  z.preprocess(blankToUndefined, check(z.coerce.number({ error: "Must be a number" })).optional());

// Form fields carry convenient units (micrometres, mm/s); the stored values are SI like the contract.
export const projectSettingsFormSchema = z.object({
  projectId: z.uuid(),
  units: z.enum(["si", "us"], "Pick SI or US customary"),
  revisionScheme: z.enum(["letters", "numbers"], "Pick a revision-label scheme"),
  // Optional so a form (or a client) that predates the setting keeps the stored paper.
  paperSize: z.enum(["a4", "letter"], "Pick A4 or Letter").optional(),
  // One-step or two-step sign-off of revisions; optional like the paper.
  signOffSteps: z.enum(["one", "two"], "Pick one-step or two-step sign-off").optional(),
  frequencySeparation: optionalNumber((n) => n.gt(0, "Must lie in (0, 1)").lt(1, "Must lie in (0, 1)")),
  maxDisplacementPeakUm: optionalNumber((n) => n.gt(0, "Must be greater than 0").max(10_000, "At most 10 000 µm")),
  maxVelocityPeakMmS: optionalNumber((n) => n.gt(0, "Must be greater than 0").max(1_000, "At most 1 000 mm/s")),
  minMassRatio: optionalNumber((n) => n.gt(0, "Must be greater than 0").max(100, "At most 100")),
  maxEccentricity: optionalNumber((n) => n.gt(0, "Must be greater than 0").max(1, "At most 1")),
  maxBearingRatio: optionalNumber((n) => n.gt(0, "Must be greater than 0").max(1, "At most 1")),
  soilBandLower: optionalNumber((n) => n.gt(0, "Must lie in (0, 1]").max(1, "Must lie in (0, 1]")),
  soilBandUpper: optionalNumber((n) => n.min(1, "Must be 1 or more").max(10, "At most 10")),
});

export type PaperSize = "a4" | "letter";
export const PAPER_SIZE_NAMES: Record<PaperSize, string> = { a4: "A4 (210 × 297 mm)", letter: "Letter (8.5 × 11 in)" };
/** The paper a new project starts with: Letter where US customary units are chosen, else A4. */
export function defaultPaperSize(units: "si" | "us"): PaperSize {
  return units === "us" ? "letter" : "a4";
}

export type ProjectSettingsForm = z.infer<typeof projectSettingsFormSchema>;

export interface ProjectSettings {
  units: "si" | "us";
  revisionScheme: "letters" | "numbers";
  /** Absent: keep the stored paper size. */
  paperSize?: PaperSize;
  /** Absent: keep the stored sign-off. */
  signOffSteps?: "one" | "two";
  criteriaDefaults: Record<string, number>;
  soilBand: { lowerFactor?: number; upperFactor?: number };
}

export function settingsFromForm(f: ProjectSettingsForm): ProjectSettings {
  const criteria: Record<string, number> = {};
  if (f.frequencySeparation !== undefined) criteria.frequencySeparation = f.frequencySeparation;
  if (f.maxDisplacementPeakUm !== undefined) criteria.maxDisplacementPeak = f.maxDisplacementPeakUm / 1e6;
  if (f.maxVelocityPeakMmS !== undefined) criteria.maxVelocityPeak = f.maxVelocityPeakMmS / 1e3;
  if (f.minMassRatio !== undefined) criteria.minMassRatio = f.minMassRatio;
  if (f.maxEccentricity !== undefined) criteria.maxEccentricity = f.maxEccentricity;
  if (f.maxBearingRatio !== undefined) criteria.maxBearingRatio = f.maxBearingRatio;
  return {
    units: f.units,
    revisionScheme: f.revisionScheme,
    ...(f.paperSize ? { paperSize: f.paperSize } : {}),
    ...(f.signOffSteps ? { signOffSteps: f.signOffSteps } : {}),
    criteriaDefaults: criteria,
    soilBand: {
      ...(f.soilBandLower !== undefined ? { lowerFactor: f.soilBandLower } : {}),
      ...(f.soilBandUpper !== undefined ? { upperFactor: f.soilBandUpper } : {}),
    },
  };
}

/**
 * Fills the criteria and soil band a draft leaves blank with the project's
 * defaults, so the calculation (and the issued revision) records what was used.
 */
export function withProjectDefaults(document: unknown, settings: Pick<ProjectSettings, "criteriaDefaults" | "soilBand">): unknown {
  if (typeof document !== "object" || document === null) return document;
  const doc = document as { criteria?: Record<string, number>; soilBand?: Record<string, number> };
  const criteria = { ...settings.criteriaDefaults, ...(doc.criteria ?? {}) };
  const soilBand = { ...settings.soilBand, ...(doc.soilBand ?? {}) };
  return {
    ...doc,
    ...(Object.keys(criteria).length ? { criteria } : {}),
    ...(Object.keys(soilBand).length ? { soilBand } : {}),
  };
}
