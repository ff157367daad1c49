"use client";

import { FieldArray, useFormikContext } from "formik";
import { CRITERIA_DEFAULTS, SOIL_BAND_DEFAULTS, SWEEP_DEFAULTS } from "@/modules/calc";
import { newPileHead, newPilesForm, newSpring, newSpringsBase, type DraftForm } from "@/modules/desk/draft-form";
import { NumberField } from "./number-field";
import { formatDefault } from "@/modules/units";
import { useUnits, type QuantityKey } from "./units-context";

const methods = [
  { value: "equivalent-radius", label: "Equivalent-radius half-space (Richart, Hall & Woods 1970; Lysmer's analog damping)" },
  { value: "gazetas", label: "Rectangular base, Gazetas (1991): static and dynamic stiffness, radiation dashpots, embedment" },
  { value: "user", label: "Springs and damping ratios from the geotechnical report or a pile-group analysis" },
  { value: "springs", label: "Inertia block on steel springs: catalogue kz and kh per spring, dampers or one damping ratio; isolation by transmissibility (Chopra §3.6)" },
  {
    value: "piles",
    label: "Pile cap on vertical piles: flexible-pile head stiffness and damping (Gazetas 1991; vertical Randolph & Wroth 1978), group interaction factors (Dobry & Gazetas 1988), sway-rocking coupling",
  },
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
                if (m.value === "piles" && !values.impedance.piles) void setFieldValue("impedance.piles", { ...newPilesForm(), heads: [newPileHead(), newPileHead(), newPileHead(), newPileHead()] });
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
                a stiffness centre off it couples the modes, which this method does not model, and the input is refused.{" "}
                {values.impedance.springsBase?.restsOn === "base" ? "Soil material damping applies to the soil under the base block only." : "Soil material damping is not applied."} Blank dampers and
                ratio: 0.5 % of critical (common practice for steel springs).
              </p>
              {(values.impedance.springs ?? []).map((_, i) => (
                <div key={i} className="grid grid-cols-2 items-end gap-2 md:grid-cols-7">
                  <NumberField name={`impedance.springs.${i}.x`} label={`Spring ${i + 1} x`} kind="length" readOnly={readOnly} compact />
                  <NumberField name={`impedance.springs.${i}.y`} label={`Spring ${i + 1} y`} kind="length" readOnly={readOnly} compact />
                  <NumberField name={`impedance.springs.${i}.kz`} label={`Spring ${i + 1} kz`} kind="stiffness" readOnly={readOnly} compact />
                  <NumberField name={`impedance.springs.${i}.kh`} label={`Spring ${i + 1} kh`} kind="stiffness" readOnly={readOnly} compact />
                  <NumberField name={`impedance.springs.${i}.cz`} label={`Spring ${i + 1} damper cz`} kind="dashpot" readOnly={readOnly} compact />
                  <NumberField name={`impedance.springs.${i}.ch`} label={`Spring ${i + 1} damper ch`} kind="dashpot" readOnly={readOnly} compact />
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
              <SpringsBaseFields readOnly={readOnly} />
            </div>
          )}
        </FieldArray>
      ) : null}
      {values.impedance.method === "piles" && values.impedance.piles ? (
        <PilesFields piles={values.impedance.piles} readOnly={readOnly} setFieldValue={setFieldValue} />
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

type PilesForm = NonNullable<DraftForm["impedance"]["piles"]>;

/** Method "piles": the pile heads in plan (a layout table), the pile, its tip and the soil profile along the shaft. */
function PilesFields({ piles, readOnly, setFieldValue }: { piles: PilesForm; readOnly: boolean; setFieldValue: (field: string, value: unknown) => unknown }) {
  const choice = <K extends "tip" | "soilProfile" | "interaction">(key: K, options: { value: PilesForm[K]; label: string }[], legend: string) => (
    <fieldset className="space-y-1" disabled={readOnly}>
      <legend className="field-label">{legend}</legend>
      {options.map((o) => (
        <label key={String(o.value)} className="flex items-start gap-2 text-sm">
          <input type="radio" name={`impedance.piles.${key}`} checked={piles[key] === o.value} onChange={() => void setFieldValue(`impedance.piles.${key}`, o.value)} className="mt-1" />
          <span>{o.label}</span>
        </label>
      ))}
    </fieldset>
  );
  return (
    <div className="space-y-3" data-testid="piles-fields">
      <p className="text-2xs text-basalt-400">
        Vertical circular piles, heads at the underside of the cap (z = 0), positions in plan in block coordinates. The piles must be flexible (longer than their active length
        2 d (Ep/Es)^¼), at least 2 diameters apart and under the cap; raked piles, a soil layer over rock and borehole layers are not offered with this method. The cap&apos;s own
        contact with the soil is ignored (common practice). The soil&apos;s G, ν, ρ and β above are those along the shaft.
      </p>
      <div className="grid max-w-4xl grid-cols-1 gap-3 md:grid-cols-4">
        <NumberField name="impedance.piles.diameter" label="Pile diameter d" kind="length" readOnly={readOnly} />
        <NumberField name="impedance.piles.length" label="Pile length L" kind="length" readOnly={readOnly} />
        <NumberField name="impedance.piles.youngsModulus" label="Young's modulus of the pile Ep" kind="modulus" readOnly={readOnly} />
        <NumberField name="impedance.piles.pileDensity" label="Pile density" kind="density" hint="Blank: 2500 kg/m³ (reinforced concrete, common practice)" readOnly={readOnly} />
      </div>
      <div className="grid max-w-3xl grid-cols-1 gap-3 md:grid-cols-3">
        {choice(
          "tip",
          [
            { value: "floating", label: "Floating (tip in the same soil)" },
            { value: "end-bearing", label: "End-bearing on a rigid stratum" },
          ],
          "Pile tip",
        )}
        {choice(
          "soilProfile",
          [
            { value: "uniform", label: "Uniform G along the shaft" },
            { value: "linear", label: "G increasing linearly with depth, G as given at depth z = d" },
          ],
          "Soil along the shaft",
        )}
        {choice(
          "interaction",
          [
            { value: "dynamic-factors", label: "Dobry & Gazetas (1988) dynamic interaction factors" },
            { value: "none", label: "None (each pile alone: overstates a close group's stiffness)" },
          ],
          "Pile-to-pile interaction",
        )}
      </div>
      <FieldArray name="impedance.piles.heads">
        {(arr) => (
          <div className="space-y-2">
            <table className="text-sm" aria-label="Pile layout">
              <thead>
                <tr>
                  <th className="pr-2 text-left">Pile</th>
                  <th className="pr-2 text-left">x</th>
                  <th className="pr-2 text-left">y</th>
                  <th />
                </tr>
              </thead>
              <tbody>
                {piles.heads.map((_, i) => (
                  <tr key={i}>
                    <td className="pr-2 align-bottom text-xs">{i + 1}</td>
                    <td className="pr-2">
                      <NumberField name={`impedance.piles.heads.${i}.x`} label={`Pile ${i + 1} x`} kind="length" readOnly={readOnly} compact />
                    </td>
                    <td className="pr-2">
                      <NumberField name={`impedance.piles.heads.${i}.y`} label={`Pile ${i + 1} y`} kind="length" readOnly={readOnly} compact />
                    </td>
                    <td className="align-bottom">
                      {readOnly ? null : (
                        <button type="button" className="btn-quiet px-1.5 py-0.5 text-2xs" disabled={piles.heads.length <= 2} onClick={() => arr.remove(i)} aria-label={`Remove pile ${i + 1}`}>
                          Remove
                        </button>
                      )}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
            {readOnly ? null : (
              <button type="button" className="btn-quiet text-xs" onClick={() => arr.push(newPileHead())}>
                Add a pile
              </button>
            )}
          </div>
        )}
      </FieldArray>
    </div>
  );
}

/** Springs only: what the springs rest on, a rigid floor or a base block on the soil (two-stage isolation, engine 1.8.0). */
function SpringsBaseFields({ readOnly }: { readOnly: boolean }) {
  const { values, setFieldValue } = useFormikContext<DraftForm>();
  const base = values.impedance.springsBase;
  const onBase = base?.restsOn === "base";
  const supports = [
    { value: "gazetas", label: "Gazetas (1991) for the base's footprint, with the dynamic coefficients chosen below" },
    { value: "equivalent-radius", label: "Equivalent-radius half-space (Richart, Hall & Woods 1970; Lysmer's analog damping)" },
    { value: "user", label: "Springs and damping ratios of the soil under the base from the geotechnical report" },
  ] as const;
  return (
    <div className="space-y-2" data-testid="springs-base-fields">
      <fieldset className="space-y-1" disabled={readOnly}>
        <legend className="field-label">The springs rest on</legend>
        <label className="flex items-start gap-2 text-sm">
          <input type="radio" name="impedance.springsBase.restsOn" checked={!onBase} onChange={() => void setFieldValue("impedance.springsBase", base ? { ...base, restsOn: "floor" } : undefined)} className="mt-1" />
          <span>A rigid floor</span>
        </label>
        <label className="flex items-start gap-2 text-sm">
          <input type="radio" name="impedance.springsBase.restsOn" checked={onBase} onChange={() => void setFieldValue("impedance.springsBase", base ? { ...base, restsOn: "base" } : newSpringsBase())} className="mt-1" />
          <span>A base block on the soil (two-stage isolation: twelve degrees of freedom)</span>
        </label>
      </fieldset>
      {onBase && base ? (
        <div className="space-y-2">
          <p className="text-2xs text-basalt-400">
            One rectangular concrete box in block coordinates; its top at or below the block&apos;s underside (the springs stand between them), every spring on it. The soil inputs
            above are the soil under the base (embedment at most the base&apos;s thickness). Speed ramps are not computed on a base block.
          </p>
          <div className="grid max-w-4xl grid-cols-2 gap-2 md:grid-cols-7">
            <NumberField name="impedance.springsBase.x.0" label="Base x from" kind="length" readOnly={readOnly} compact />
            <NumberField name="impedance.springsBase.x.1" label="Base x to" kind="length" readOnly={readOnly} compact />
            <NumberField name="impedance.springsBase.y.0" label="Base y from" kind="length" readOnly={readOnly} compact />
            <NumberField name="impedance.springsBase.y.1" label="Base y to" kind="length" readOnly={readOnly} compact />
            <NumberField name="impedance.springsBase.z.0" label="Base z from" kind="length" readOnly={readOnly} compact />
            <NumberField name="impedance.springsBase.z.1" label="Base z to" kind="length" readOnly={readOnly} compact />
            <NumberField name="impedance.springsBase.concreteDensity" label="Base concrete density" kind="density" hint="Blank: the block's" readOnly={readOnly} compact />
          </div>
          <fieldset className="space-y-1" disabled={readOnly}>
            <legend className="field-label">Soil under the base</legend>
            {supports.map((o) => (
              <label key={o.value} className="flex items-start gap-2 text-sm">
                <input type="radio" name="impedance.springsBase.support" checked={base.support === o.value} onChange={() => void setFieldValue("impedance.springsBase.support", o.value)} className="mt-1" />
                <span>{o.label}</span>
              </label>
            ))}
          </fieldset>
          {base.support === "gazetas" ? (
            <fieldset className="space-y-1" disabled={readOnly}>
              <legend className="field-label">Dynamic coefficients under the base</legend>
              {(
                [
                  ["published", "Gazetas' charts (1991, digitised)"],
                  ["pais-kausel", "Pais & Kausel closed forms (1988)"],
                  ["simplified", "Simplified: k = 1, every dashpot coefficient 1 (warned)"],
                ] as const
              ).map(([value, label]) => (
                <label key={value} className="flex items-start gap-2 text-sm">
                  <input type="radio" name="impedance.gazetasDynamic" checked={values.impedance.gazetasDynamic === value} onChange={() => void setFieldValue("impedance.gazetasDynamic", value)} className="mt-1" />
                  <span>{label}</span>
                </label>
              ))}
            </fieldset>
          ) : null}
          {base.support === "user" ? (
            <div className="grid grid-cols-2 gap-2 md:grid-cols-3">
              {dofs.map(([k, label, kind]) => (
                <div key={k} className="grid grid-cols-2 gap-1">
                  <NumberField name={`impedance.stiffness.${k}`} label={`Base ${label.toLowerCase()} k`} kind={kind} readOnly={readOnly} />
                  <NumberField name={`impedance.dampingRatio.${k}`} label={`base ${label.toLowerCase()} damping ratio`} kind="ratio" readOnly={readOnly} />
                </div>
              ))}
            </div>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
