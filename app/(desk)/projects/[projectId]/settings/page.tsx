import type { Metadata } from "next";
import { CRITERIA_DEFAULTS, SOIL_BAND_DEFAULTS } from "@/modules/calc";
import { requireProjectPage } from "../../../../_lib/page-guard";
import { SettingsForm } from "./settings-form";

export const metadata: Metadata = { title: "Project settings" };

export default async function SettingsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const { project } = await requireProjectPage(projectId, "project.update");
  const c = project.criteriaDefaults;
  const band = project.soilBand;
  const num = (v: number | undefined, scale = 1) => (v === undefined ? "" : String(Number((v * scale).toPrecision(6))));
  return (
    <div className="max-w-4xl space-y-6">
      <div>
        <p className="font-mono text-xs text-basalt-400">{project.code}</p>
        <h1>Project settings</h1>
        <p className="mt-1 text-sm text-basalt-500">Defaults for every foundation of the project. A draft that sets its own value keeps it; blank fields here fall back to the product defaults shown with their sources.</p>
      </div>
      <SettingsForm
        projectId={projectId}
        initial={{
          units: project.units,
          revisionScheme: project.revisionScheme,
          paperSize: project.paperSize,
          signOffSteps: project.signOffSteps,
          frequencySeparation: num(c.frequencySeparation),
          maxDisplacementPeakUm: num(c.maxDisplacementPeak, 1e6),
          maxVelocityPeakMmS: num(c.maxVelocityPeak, 1e3),
          minMassRatio: num(c.minMassRatio),
          maxEccentricity: num(c.maxEccentricity),
          maxBearingRatio: num(c.maxBearingRatio),
          soilBandLower: num(band.lowerFactor),
          soilBandUpper: num(band.upperFactor),
        }}
        defaults={{
          frequencySeparation: [String(CRITERIA_DEFAULTS.frequencySeparation.value), CRITERIA_DEFAULTS.frequencySeparation.source],
          maxDisplacementPeakUm: [(CRITERIA_DEFAULTS.maxDisplacementPeak.value * 1e6).toFixed(1), CRITERIA_DEFAULTS.maxDisplacementPeak.source],
          maxVelocityPeakMmS: [(CRITERIA_DEFAULTS.maxVelocityPeak.value * 1e3).toFixed(2), CRITERIA_DEFAULTS.maxVelocityPeak.source],
          minMassRatio: [String(CRITERIA_DEFAULTS.minMassRatio.value), CRITERIA_DEFAULTS.minMassRatio.source],
          maxEccentricity: [String(CRITERIA_DEFAULTS.maxEccentricity.value), CRITERIA_DEFAULTS.maxEccentricity.source],
          maxBearingRatio: [String(CRITERIA_DEFAULTS.maxBearingRatio.value), CRITERIA_DEFAULTS.maxBearingRatio.source],
          soilBandLower: [SOIL_BAND_DEFAULTS.lowerFactor.toFixed(3), SOIL_BAND_DEFAULTS.source],
          soilBandUpper: [String(SOIL_BAND_DEFAULTS.upperFactor), SOIL_BAND_DEFAULTS.source],
        }}
      />
    </div>
  );
}
