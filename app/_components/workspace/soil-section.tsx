"use client";

import { FieldArray, useFormikContext } from "formik";
import { useState } from "react";
import { soilHints, vsFromSpt } from "@/modules/desk/balance-grades";
import { newSoilLayer, type DraftForm } from "@/modules/desk/draft-form";
import { NumberField } from "./number-field";
import { useUnits } from "./units-context";

export function SoilSection({ readOnly }: { readOnly: boolean }) {
  const { values, setFieldValue } = useFormikContext<DraftForm>();
  const units = useUnits();
  const [spt, setSpt] = useState("");
  const n = Number(spt);
  const vs = spt && Number.isFinite(n) && n > 0 ? vsFromSpt(n) : null;
  const useG = values.soil.modulusSource === "shearModulus";
  const profile = values.soil.profile;
  const layered = profile === "layers";
  return (
    <div className="space-y-4">
      <fieldset className="flex flex-wrap gap-4 text-sm" disabled={readOnly}>
        <legend className="field-label">Ground below the base</legend>
        {(
          [
            ["half-space", "uniform soil to great depth (half-space)"],
            ["stratum", "one soil layer over rock"],
            ["layers", "borehole layers over rock"],
          ] as const
        ).map(([value, label]) => (
          <label key={value} className="flex items-center gap-1.5">
            <input
              type="radio"
              name="soil.profile"
              checked={profile === value}
              onChange={() => {
                void setFieldValue("soil.profile", value);
                if (value === "layers" && values.soil.layers.length === 0) void setFieldValue("soil.layers", [newSoilLayer()]);
              }}
            />{" "}
            {label}
          </label>
        ))}
      </fieldset>
      {profile === "stratum" ? (
        <div className="grid grid-cols-1 gap-3 md:grid-cols-2 xl:grid-cols-3">
          <NumberField
            name="soil.stratumThickness"
            label="Depth from grade to rock H"
            kind="length"
            hint="The soil above is taken as uniform; rock as a rigid base. No radiation damping below V_La/4H (vertical, rocking) and Vs/4H (sliding, torsion)."
            readOnly={readOnly}
          />
        </div>
      ) : null}
      {layered ? (
        <FieldArray name="soil.layers">
          {(arr) => (
            <div className="space-y-2" data-testid="soil-layers">
              <p className="text-2xs text-basalt-400">
                Top down, to rock. Reduced to one layer with the travel-time average Vs = Σh / Σ(h/Vs) over the depth (the Vs30 rule of ASCE 7-16 and EN 1998-1), thickness-weighted density and ν; the result shows the values used.
              </p>
              {values.soil.layers.map((layer, i) => (
                <div key={i} className="grid grid-cols-2 items-end gap-2 md:grid-cols-6">
                  <NumberField name={`soil.layers.${i}.thickness`} label={`Layer ${i + 1} thickness`} kind="length" readOnly={readOnly} compact />
                  <NumberField name={`soil.layers.${i}.shearWaveVelocity`} label="Vs" kind="waveSpeed" readOnly={readOnly} compact />
                  {layer.shearModulus !== null ? <NumberField name={`soil.layers.${i}.shearModulus`} label="or G" kind="modulus" readOnly={readOnly} compact /> : <span />}
                  <NumberField name={`soil.layers.${i}.density`} label="ρ" kind="density" readOnly={readOnly} compact />
                  <NumberField name={`soil.layers.${i}.poissonRatio`} label="ν (blank: the soil's)" kind="ratio" readOnly={readOnly} compact />
                  {readOnly ? null : (
                    <button type="button" className="btn-quiet px-1.5 py-0.5 text-2xs" disabled={values.soil.layers.length === 1} onClick={() => arr.remove(i)} aria-label={`Remove layer ${i + 1}`}>
                      Remove
                    </button>
                  )}
                </div>
              ))}
              {readOnly ? null : (
                <button type="button" className="btn-quiet text-xs" onClick={() => arr.push(newSoilLayer())}>
                  Add a layer
                </button>
              )}
            </div>
          )}
        </FieldArray>
      ) : null}
      <fieldset className="flex flex-wrap gap-4 text-sm" disabled={readOnly || layered}>
        <legend className="field-label">Stiffness given as</legend>
        <label className="flex items-center gap-1.5">
          <input type="radio" name="soil.modulusSource" checked={!useG} onChange={() => void setFieldValue("soil.modulusSource", "shearWaveVelocity")} /> shear-wave velocity Vs
        </label>
        <label className="flex items-center gap-1.5">
          <input type="radio" name="soil.modulusSource" checked={useG} onChange={() => void setFieldValue("soil.modulusSource", "shearModulus")} /> shear modulus G
        </label>
      </fieldset>
      <div className="grid grid-cols-1 gap-3 md:grid-cols-2 xl:grid-cols-3">
        {layered ? null : useG ? (
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
