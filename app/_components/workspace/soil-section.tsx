"use client";

import { useFormikContext } from "formik";
import { useState } from "react";
import { soilHints, vsFromSpt } from "@/modules/desk/balance-grades";
import type { DraftForm } from "@/modules/desk/draft-form";
import { NumberField } from "./number-field";
import { useUnits } from "./units-context";

export function SoilSection({ readOnly }: { readOnly: boolean }) {
  const { values, setFieldValue } = useFormikContext<DraftForm>();
  const units = useUnits();
  const [spt, setSpt] = useState("");
  const n = Number(spt);
  const vs = spt && Number.isFinite(n) && n > 0 ? vsFromSpt(n) : null;
  const useG = values.soil.modulusSource === "shearModulus";
  return (
    <div className="space-y-4">
      <fieldset className="flex flex-wrap gap-4 text-sm" disabled={readOnly}>
        <legend className="field-label">Stiffness given as</legend>
        <label className="flex items-center gap-1.5">
          <input type="radio" name="soil.modulusSource" checked={!useG} onChange={() => void setFieldValue("soil.modulusSource", "shearWaveVelocity")} /> shear-wave velocity Vs
        </label>
        <label className="flex items-center gap-1.5">
          <input type="radio" name="soil.modulusSource" checked={useG} onChange={() => void setFieldValue("soil.modulusSource", "shearModulus")} /> shear modulus G
        </label>
      </fieldset>
      <div className="grid grid-cols-1 gap-3 md:grid-cols-2 xl:grid-cols-3">
        {useG ? (
          <NumberField name="soil.shearModulus" label="Shear modulus G" kind="modulus" hint={soilHints.shearModulus} readOnly={readOnly} />
        ) : (
          <NumberField name="soil.shearWaveVelocity" label="Shear-wave velocity Vs" kind="waveSpeed" hint={soilHints.shearWaveVelocity} readOnly={readOnly} />
        )}
        <NumberField name="soil.poissonRatio" label="Poisson's ratio ν" kind="ratio" hint={soilHints.poissonRatio} readOnly={readOnly} />
        <NumberField name="soil.density" label="Soil density ρ" kind="density" hint={soilHints.density} readOnly={readOnly} />
        <NumberField name="soil.materialDamping" label="Material damping β" kind="ratio" hint={soilHints.materialDamping} readOnly={readOnly} />
        <NumberField name="soil.allowableBearingPressure" label="Allowable bearing pressure" kind="pressure" hint={soilHints.allowableBearingPressure} readOnly={readOnly} />
        <NumberField name="soil.embedmentDepth" label="Embedment depth" kind="length" hint={soilHints.embedment} readOnly={readOnly} />
        <NumberField name="soil.sidewallContactHeight" label="Sidewall contact height" kind="length" readOnly={readOnly} />
      </div>
      <div className="rounded-plinth border border-grout-200 bg-grout-50 p-3">
        <p className="text-xs font-semibold text-basalt-700">Vs from an SPT blow count</p>
        <p className="text-2xs text-basalt-400">Imai &amp; Tonouchi (1982): Vs = 97.0 N^0.314 m/s. A correlation with wide scatter: prefer measured Vs.</p>
        <div className="mt-2 flex flex-wrap items-end gap-2">
          <label className="text-xs">
            <span className="field-label">N (blows/0.3 m)</span>
            <input className="field-input w-28 font-mono" inputMode="decimal" value={spt} onChange={(e) => setSpt(e.target.value)} aria-label="SPT N" disabled={readOnly} />
          </label>
          <span className="pb-2 font-mono text-sm" data-testid="spt-vs">
            {vs ? `Vs ≈ ${units.toDisplayText("waveSpeed", vs)} ${units.unitLabel("waveSpeed")}` : "—"}
          </span>
          {vs && !readOnly ? (
            <button
              type="button"
              className="btn-quiet text-xs"
              onClick={() => {
                void setFieldValue("soil.modulusSource", "shearWaveVelocity");
                void setFieldValue("soil.shearWaveVelocity", Math.round(vs));
              }}
            >
              Use this Vs
            </button>
          ) : null}
        </div>
      </div>
    </div>
  );
}
