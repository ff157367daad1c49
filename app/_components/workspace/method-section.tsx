"use client";

import { FieldArray, useFormikContext } from "formik";
import { CRITERIA_DEFAULTS, SOIL_BAND_DEFAULTS, SWEEP_DEFAULTS } from "@/modules/calc";
import { newSpring, type DraftForm } from "@/modules/desk/draft-form";
import { NumberField } from "./number-field";
import { formatDefault } from "@/modules/units";
import { useUnits, type QuantityKey } from "./units-context";

const methods = [
  { value: "equivalent-radius", label: "Equivalent-radius half-space (Richart, Hall & Woods 1970; Lysmer's analog damping)" },
  { value: "gazetas", label: "Rectangular base, Gazetas (1991): static and dynamic stiffness, radiation dashpots, embedment" },
  { value: "user", label: "Springs and damping ratios from the geotechnical report or a pile-group analysis" },
  { value: "springs", label: "Inertia block on steel springs: catalogue kz and kh per spring, dampers or one damping ratio; isolation by transmissibility (Chopra §3.6)" },
] as const;

const dofs = [
  ["x", "Sliding x", "stiffness"],
  ["y", "Sliding y", "stiffness"],
  ["z", "Vertical z", "stiffness"],
  ["rx", "Rocking about x", "rotationalStiffness"],
  ["ry", "Rocking about y", "rotationalStiffness"],
  ["rz", "Torsion about z", "rotationalStiffness"],
] as const;

const criteria: { key: keyof typeof CRITERIA_DEFAULTS; label: string; kind: QuantityKey }[] = [
  { key: "frequencySeparation", label: "Frequency separation", kind: "ratio" },
  { key: "maxDisplacementPeak", label: "Displacement limit (peak)", kind: "displacement" },
  { key: "maxVelocityPeak", label: "Velocity limit (peak)", kind: "velocity" },
  { key: "minMassRatio", label: "Least block/machine mass ratio", kind: "ratio" },
  { key: "maxEccentricity", label: "Largest eccentricity (fraction of base)", kind: "ratio" },
  { key: "maxBearingRatio", label: "Largest bearing pressure / allowable", kind: "ratio" },
];

export function MethodSection({ readOnly, projectCriteria }: { readOnly: boolean; projectCriteria?: Record<string, number> }) {
  const { values, handleChange, setFieldValue } = useFormikContext<DraftForm>();
  const units = useUnits();
  return (
    <div className="space-y-4">
      <fieldset className="space-y-1.5" disabled={readOnly}>
        <legend className="field-label">Soil impedance</legend>
        {methods.map((m) => (
          <label key={m.value} className="flex items-start gap-2 text-sm">
            <input
              type="radio"
              name="impedance.method"
              value={m.value}
              checked={values.impedance.method === m.value}
              onChange={(e) => {
                handleChange(e);
                if (m.value === "springs" && (values.impedance.springs ?? []).length === 0) void setFieldValue("impedance.springs", [newSpring(), newSpring(), newSpring(), newSpring()]);
              }}
              className="mt-1"
            />
            <span>{m.label}</span>
          </label>
        ))}
      </fieldset>
      {values.impedance.method === "gazetas" ? (
        <fieldset className="space-y-1.5" disabled={readOnly}>
          <legend className="field-label">Dynamic coefficients k(a0), c(a0)</legend>
          <label className="flex items-start gap-2 text-sm">
            <input type="radio" name="impedance.gazetasDynamic" checked={values.impedance.gazetasDynamic === "published"} onChange={() => void setFieldValue("impedance.gazetasDynamic", "published")} className="mt-1" />
            <span>Gazetas&apos; charts (1991, Table 1 graphs, digitised), with sidewall dashpots when embedded</span>
          </label>
          <label className="flex items-start gap-2 text-sm">
            <input type="radio" name="impedance.gazetasDynamic" checked={values.impedance.gazetasDynamic === "pais-kausel"} onChange={() => void setFieldValue("impedance.gazetasDynamic", "pais-kausel")} className="mt-1" />
            <span>Pais &amp; Kausel closed forms (1988, as reprinted in NIST GCR 12-917-21), with sidewall dashpots when embedded (more rocking damping than the charts on a squarish base at a0 = 1-2: the unsafe side there)</span>
          </label>
          <label className="flex items-start gap-2 text-sm">
            <input type="radio" name="impedance.gazetasDynamic" checked={values.impedance.gazetasDynamic === "simplified"} onChange={() => void setFieldValue("impedance.gazetasDynamic", "simplified")} className="mt-1" />
            <span>Simplified: k_z = k_y = 1, every dashpot coefficient 1 (overstates rocking damping at low a0; warned)</span>
          </label>
        </fieldset>
      ) : null}
      {values.impedance.method === "user" ? (
        <div className="grid grid-cols-2 gap-2 md:grid-cols-3">
          {dofs.map(([k, label, kind]) => (
            <div key={k} className="grid grid-cols-2 gap-1">
              <NumberField name={`impedance.stiffness.${k}`} label={`${label} k`} kind={kind} readOnly={readOnly} />
              <NumberField name={`impedance.dampingRatio.${k}`} label="damping ratio" kind="ratio" readOnly={readOnly} />
            </div>
          ))}
        </div>
      ) : null}
      {values.impedance.method === "springs" ? (
        <FieldArray name="impedance.springs">
          {(arr) => (
            <div className="space-y-2">
              <p className="text-2xs text-basalt-400">
                Spring positions in plan (the spring tops bear on the underside of the block), catalogue stiffness as typed. The layout must be symmetric about the centroid of the base:
                a stiffness centre off it couples the modes, which this method does not model, and the input is refused. Soil material damping is not applied. Blank dampers and
                ratio: 0.5 % of critical (common practice for steel springs).
              </p>
              {(values.impedance.springs ?? []).map((_, i) => (
                <div key={i} className="grid grid-cols-2 items-end gap-2 md:grid-cols-7">
                  <NumberField name={`impedance.springs.${i}.x`} label={`Spring ${i + 1} x`} kind="length" readOnly={readOnly} compact />
                  <NumberField name={`impedance.springs.${i}.y`} label="y" kind="length" readOnly={readOnly} compact />
                  <NumberField name={`impedance.springs.${i}.kz`} label="kz" kind="stiffness" readOnly={readOnly} compact />
                  <NumberField name={`impedance.springs.${i}.kh`} label="kh" kind="stiffness" readOnly={readOnly} compact />
                  <NumberField name={`impedance.springs.${i}.cz`} label="damper cz" kind="dashpot" readOnly={readOnly} compact />
                  <NumberField name={`impedance.springs.${i}.ch`} label="damper ch" kind="dashpot" readOnly={readOnly} compact />
                  {readOnly ? null : (
                    <button type="button" className="btn-quiet px-1.5 py-0.5 text-2xs" disabled={(values.impedance.springs ?? []).length <= 3} onClick={() => arr.remove(i)} aria-label={`Remove spring ${i + 1}`}>
                      Remove
                    </button>
                  )}
                </div>
              ))}
              {readOnly ? null : (
                <button type="button" className="btn-quiet text-xs" onClick={() => arr.push(newSpring())}>
                  Add a spring
                </button>
              )}
              <div className="max-w-xs">
                <NumberField name="impedance.springsDampingRatio" label="Damping ratio (without dampers)" kind="ratio" readOnly={readOnly} />
              </div>
            </div>
          )}
        </FieldArray>
      ) : null}
      <div>
        <p className="field-label">Acceptance criteria (blank: the default shown)</p>
        <div className="grid grid-cols-1 gap-3 md:grid-cols-2 xl:grid-cols-3">
          {criteria.map((c) => {
            const fallback = projectCriteria?.[c.key] ?? CRITERIA_DEFAULTS[c.key].value;
            return (
              <div key={c.key}>
                <NumberField name={`criteria.${c.key}`} label={c.label} kind={c.kind} readOnly={readOnly} />
                <p className="mt-0.5 text-2xs text-basalt-400" title={CRITERIA_DEFAULTS[c.key].source}>
                  default {formatDefault(c.kind, fallback, units.system)} · {CRITERIA_DEFAULTS[c.key].source}
                </p>
              </div>
            );
          })}
        </div>
      </div>
      <div className="grid max-w-xl grid-cols-2 gap-3">
        <NumberField name="soilBand.lowerFactor" label="Soil band: lower factor on G" kind="ratio" readOnly={readOnly} />
        <NumberField name="soilBand.upperFactor" label="upper factor on G" kind="ratio" readOnly={readOnly} />
        <p className="col-span-2 text-2xs text-basalt-400">Blank: G / 1.5 and 1.5 G. {SOIL_BAND_DEFAULTS.source}</p>
      </div>
      <div className="grid max-w-xl grid-cols-3 gap-3">
        <NumberField name="sweep.fromHz" label="Plot from" kind="frequency" readOnly={readOnly} />
        <NumberField name="sweep.toHz" label="Plot to" kind="frequency" readOnly={readOnly} />
        <NumberField name="sweep.points" label="Points" kind="ratio" readOnly={readOnly} />
        <p className="col-span-3 text-2xs text-basalt-400">Blank: {SWEEP_DEFAULTS.fromHz}–{SWEEP_DEFAULTS.toHz} Hz in {SWEEP_DEFAULTS.points} points (the upper end rises with the fastest operating speed).</p>
      </div>
    </div>
  );
}
