"use client";

import { useActionState } from "react";
import { FormMessage, SubmitButton, TextField, type FormState } from "../../../../_components/form-kit";
import { updateProjectSettingsAction } from "../../../actions";

const fields = [
  ["frequencySeparation", "Frequency separation (fraction)"],
  ["maxDisplacementPeakUm", "Displacement limit, peak (µm)"],
  ["maxVelocityPeakMmS", "Velocity limit, peak (mm/s)"],
  ["minMassRatio", "Least block/machine mass ratio"],
  ["maxEccentricity", "Largest eccentricity (fraction of base)"],
  ["maxBearingRatio", "Largest static bearing pressure / allowable"],
  ["soilBandLower", "Soil band: lower factor on G"],
  ["soilBandUpper", "Soil band: upper factor on G"],
] as const;

type Key = (typeof fields)[number][0];

export function SettingsForm({
  projectId,
  initial,
  defaults,
}: {
  projectId: string;
  initial: Record<Key, string> & { units: "si" | "us"; revisionScheme: "letters" | "numbers"; paperSize: "a4" | "letter"; signOffSteps: "one" | "two" };
  defaults: Record<Key, [string, string]>;
}) {
  const [state, action] = useActionState(updateProjectSettingsAction as unknown as (s: FormState, f: FormData) => Promise<FormState>, null);
  return (
    <form action={action} className="space-y-5" noValidate>
      <input type="hidden" name="projectId" value={projectId} />
      <div className="slab grid grid-cols-1 gap-4 p-5 sm:grid-cols-2">
        <div>
          <label htmlFor="f-units" className="field-label">
            Units for entry and display (project default)
          </label>
          <select id="f-units" name="units" defaultValue={initial.units} className="field-input">
            <option value="si">SI</option>
            <option value="us">US customary</option>
          </select>
          <p className="mt-1 text-2xs text-basalt-400">Stored data stay SI; each person may switch in the workspace.</p>
        </div>
        <div>
          <label htmlFor="f-rev" className="field-label">
            Revision labels
          </label>
          <select id="f-rev" name="revisionScheme" defaultValue={initial.revisionScheme} className="field-input">
            <option value="letters">Letters A, B, C (while in check)</option>
            <option value="numbers">Numbers 0, 1, 2 (issued for construction)</option>
          </select>
        </div>
        <div>
          <label htmlFor="f-paper" className="field-label">
            Paper of the calculation package
          </label>
          <select id="f-paper" name="paperSize" defaultValue={initial.paperSize} className="field-input">
            <option value="a4">A4 (210 × 297 mm)</option>
            <option value="letter">Letter (8.5 × 11 in)</option>
          </select>
          <p className="mt-1 text-2xs text-basalt-400">Page setup of the workbook and the size of the PDF.</p>
        </div>
        <div>
          <label htmlFor="f-signoff" className="field-label">
            Sign-off of a revision
          </label>
          <select id="f-signoff" name="signOffSteps" defaultValue={initial.signOffSteps} className="field-input">
            <option value="one">One step: a checker or manager approves</option>
            <option value="two">Two steps: checked, then approved by someone else</option>
          </select>
          <p className="mt-1 text-2xs text-basalt-400">Neither signature may be given by someone who wrote the revision.</p>
        </div>
      </div>
      <div className="slab grid grid-cols-1 gap-4 p-5 sm:grid-cols-2">
        {fields.map(([key, label]) => (
          <TextField
            key={key}
            name={key}
            label={label}
            state={state}
            defaultValue={initial[key]}
            hint={
              <>
                Blank: {defaults[key][0]} — {defaults[key][1]}
              </>
            }
          />
        ))}
      </div>
      <FormMessage state={state && state.ok ? { ok: true, message: "Settings saved." } : state} />
      <SubmitButton>Save settings</SubmitButton>
    </form>
  );
}
