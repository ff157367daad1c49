"use client";

import { FieldArray, useFormikContext } from "formik";
import { BALANCE_GRADE_SOURCE, balanceGradeClasses } from "@/modules/desk/balance-grades";
import { newMachine, newRotor, type DraftForm } from "@/modules/desk/draft-form";
import { ROTOR_DEFAULTS } from "@/modules/desk/rotor-defaults";
import { MachineDatumPanel } from "./machine-datum-panel";
import { NumberField } from "./number-field";

function Vec3Inputs({ base, label, kind, readOnly }: { base: string; label: string; kind: "length"; readOnly: boolean }) {
  return (
    <div>
      <span className="field-label">{label}</span>
      <div className="grid grid-cols-3 gap-1">
        {(["x", "y", "z"] as const).map((axis, j) => (
          <NumberField key={axis} compact name={`${base}[${j}]`} label={`${label} ${axis}`} kind={kind} readOnly={readOnly} />
        ))}
      </div>
    </div>
  );
}

export function MachinesSection({ readOnly }: { readOnly: boolean }) {
  const { values, handleChange, setFieldValue } = useFormikContext<DraftForm>();
  return (
    <FieldArray name="machines">
      {(machines) => (
        <div className="space-y-4">
          {values.machines.length === 0 ? (
            <p className="field-error" data-testid="no-machines">
              Required: at least one machine (the draft saves without one; the analysis waits).
            </p>
          ) : null}
          {values.machines.map((m, mi) => (
            <div key={mi} className="rounded-plinth border border-grout-300 p-3" data-testid={`machine-${mi}`}>
              <div className="flex flex-wrap items-end gap-3">
                <label className="min-w-48 flex-1">
                  <span className="field-label">Machine</span>
                  <input className="field-input" name={`machines[${mi}].name`} value={m.name} onChange={handleChange} readOnly={readOnly} />
                </label>
                <div className="w-40">
                  <NumberField name={`machines[${mi}].mass`} label="Mass" kind="mass" readOnly={readOnly} />
                </div>
                <div className="w-64">
                  <Vec3Inputs base={`machines[${mi}].cg`} label="Centre of gravity" kind="length" readOnly={readOnly} />
                </div>
                <label className="flex items-center gap-1.5 pb-2 text-xs">
                  <input type="checkbox" name={`machines[${mi}].box.enabled`} checked={m.box.enabled} onChange={handleChange} disabled={readOnly} /> model as a box
                </label>
                {readOnly ? null : (
                  <button type="button" className="btn-danger text-xs" onClick={() => machines.remove(mi)}>
                    Remove machine
                  </button>
                )}
              </div>
              <MachineDatumPanel mi={mi} machine={m} readOnly={readOnly} />
              {m.box.enabled ? (
                <div className="mt-2 grid grid-cols-3 gap-2 md:grid-cols-6">
                  {(["x", "y", "z"] as const).flatMap((axis) =>
                    [0, 1].map((j) => (
                      <NumberField key={`${axis}${j}`} name={`machines[${mi}].box.${axis}[${j}]`} label={`Box ${axis} ${j === 0 ? "from" : "to"}`} kind="length" readOnly={readOnly} />
                    )),
                  )}
                </div>
              ) : null}
              <FieldArray name={`machines[${mi}].rotors`}>
                {(rotors) => (
                  <div className="mt-3 space-y-3">
                    {m.rotors.map((r, ri) => {
                      const base = `machines[${mi}].rotors[${ri}]`;
                      return (
                        <div key={ri} className="rounded-plinth bg-grout-50 p-3">
                          <div className="grid grid-cols-2 gap-2 md:grid-cols-4 xl:grid-cols-6">
                            <label>
                              <span className="field-label">Rotor</span>
                              <input className="field-input" name={`${base}.name`} value={r.name} onChange={handleChange} readOnly={readOnly} />
                            </label>
                            <NumberField name={`${base}.mass`} label="Rotor mass" kind="mass" readOnly={readOnly} />
                            <NumberField name={`${base}.speedRpm`} label="Rated speed" kind="speed" readOnly={readOnly} />
                            <NumberField name={`${base}.speedRangeRpm[0]`} label="Range from" kind="speed" readOnly={readOnly} hint="Blank: fixed speed" />
                            <NumberField name={`${base}.speedRangeRpm[1]`} label="Range to" kind="speed" readOnly={readOnly} />
                            <label>
                              <span className="field-label">Shaft axis</span>
                              <select className="field-input" name={`${base}.axis`} value={r.axis} onChange={handleChange} disabled={readOnly}>
                                <option value="x">along x</option>
                                <option value="y">along y</option>
                                <option value="z">vertical (z)</option>
                              </select>
                            </label>
                            <label>
                              <span className="field-label">Unbalance from</span>
                              <select className="field-input" name={`${base}.unbalanceSource`} value={r.unbalanceSource} onChange={handleChange} disabled={readOnly}>
                                <option value="grade">balance grade</option>
                                <option value="force">vendor force</option>
                              </select>
                            </label>
                            {r.unbalanceSource === "grade" ? (
                              <label className="col-span-2">
                                <span className="field-label">Balance grade (ISO 1940-1)</span>
                                <select
                                  className="field-input"
                                  value={String(r.balanceGrade ?? "")}
                                  onChange={(e) => void setFieldValue(`${base}.balanceGrade`, e.target.value ? Number(e.target.value) : null)}
                                  disabled={readOnly}
                                  aria-label="Balance grade"
                                >
                                  <option value="">pick a grade</option>
                                  {balanceGradeClasses.map((g) => (
                                    <option key={g.grade} value={g.grade}>
                                      {g.label}
                                    </option>
                                  ))}
                                </select>
                                <span className="mt-1 block text-2xs text-basalt-400">{BALANCE_GRADE_SOURCE}</span>
                              </label>
                            ) : (
                              <NumberField name={`${base}.unbalanceForce`} label="Vendor force at rated speed" kind="force" readOnly={readOnly} />
                            )}
                            <NumberField name={`${base}.serviceFactor`} label="Service factor" kind="ratio" readOnly={readOnly} hint={`Default ${ROTOR_DEFAULTS.serviceFactor.value} (${ROTOR_DEFAULTS.serviceFactor.source})`} />
                            <label>
                              <span className="field-label">Unbalance</span>
                              <select className="field-input" name={`${base}.unbalanceMode`} value={r.unbalanceMode} onChange={handleChange} disabled={readOnly}>
                                <option value="static">static (bearings in phase)</option>
                                <option value="couple">couple (ends opposed)</option>
                                <option value="both">both</option>
                              </select>
                            </label>
                          </div>
                          <FieldArray name={`${base}.bearings`}>
                            {(bearings) => (
                              <div className="mt-2 flex flex-wrap items-end gap-3">
                                {r.bearings.map((_, bi) => (
                                  <div key={bi} className="w-64">
                                    <Vec3Inputs base={`${base}.bearings[${bi}]`} label={`Bearing ${bi + 1}`} kind="length" readOnly={readOnly} />
                                    {readOnly || r.bearings.length <= 1 ? null : (
                                      <button type="button" className="mt-1 text-2xs text-brick-700 underline" onClick={() => bearings.remove(bi)}>
                                        remove bearing
                                      </button>
                                    )}
                                  </div>
                                ))}
                                {readOnly ? null : (
                                  <button type="button" className="btn-quiet text-xs" onClick={() => bearings.push([null, 0, null])}>
                                    Add bearing
                                  </button>
                                )}
                              </div>
                            )}
                          </FieldArray>
                          {readOnly ? null : (
                            <button type="button" className="mt-2 text-2xs text-brick-700 underline" onClick={() => rotors.remove(ri)}>
                              remove rotor
                            </button>
                          )}
                        </div>
                      );
                    })}
                    {readOnly ? null : (
                      <button type="button" className="btn-quiet text-xs" onClick={() => rotors.push(newRotor())}>
                        Add rotor
                      </button>
                    )}
                  </div>
                )}
              </FieldArray>
            </div>
          ))}
          {readOnly ? null : (
            <button type="button" className="btn-quiet text-xs" onClick={() => machines.push(newMachine(values.machines.length + 1))}>
              Add machine
            </button>
          )}
          <CheckPoints readOnly={readOnly} />
        </div>
      )}
    </FieldArray>
  );
}

function CheckPoints({ readOnly }: { readOnly: boolean }) {
  const { values, handleChange } = useFormikContext<DraftForm>();
  return (
    <FieldArray name="checkPoints">
      {(arr) => (
        <div className="rounded-plinth border border-dashed border-grout-300 p-3">
          <p className="field-label">Extra check points</p>
          <div className="flex flex-wrap items-end gap-3">
            {values.checkPoints.map((c, i) => (
              <div key={i} className="w-72 space-y-1">
                <input className="field-input text-xs" name={`checkPoints[${i}].name`} value={c.name} onChange={handleChange} readOnly={readOnly} aria-label={`Check point ${i + 1} name`} />
                <Vec3Inputs base={`checkPoints[${i}].position`} label="Position" kind="length" readOnly={readOnly} />
                {readOnly ? null : (
                  <button type="button" className="text-2xs text-brick-700 underline" onClick={() => arr.remove(i)}>
                    remove
                  </button>
                )}
              </div>
            ))}
            {readOnly ? null : (
              <button type="button" className="btn-quiet text-xs" onClick={() => arr.push({ name: `Point ${values.checkPoints.length + 1}`, position: [0, 0, null] })}>
                Add check point
              </button>
            )}
          </div>
        </div>
      )}
    </FieldArray>
  );
}
