"use client";

import { getIn, useFormikContext } from "formik";
import { useId, useState } from "react";
import { useUnits, type QuantityKey } from "./units-context";
import { FieldCommentMarker } from "./review-comments";
import { markInput } from "./input-timing";

/**
 * A numeric input bound to a formik field that holds the SI value. It shows and
 * takes the value in the user's display units; what is stored stays SI.
 */
export function NumberField({
  name,
  label,
  kind,
  hint,
  readOnly,
  compact,
}: {
  name: string;
  label: string;
  kind: QuantityKey;
  hint?: string;
  readOnly?: boolean;
  compact?: boolean;
}) {
  const { values, errors, touched, setFieldValue, setFieldTouched, status } = useFormikContext<Record<string, unknown>>();
  const units = useUnits();
  const si = getIn(values, name) as number | null | undefined;
  // While the field has focus it shows exactly what is typed; otherwise the stored SI value in display units.
  const [text, setText] = useState("");
  const [focused, setFocused] = useState(false);
  const id = useId();
  const shown = focused ? text : units.toDisplayText(kind, si);
  const clientError = getIn(touched, name) ? (getIn(errors, name) as string | undefined) : undefined;
  const serverError = (status as { serverIssues?: Record<string, string> } | undefined)?.serverIssues?.[name];
  const error = typeof clientError === "string" ? clientError : serverError;
  const unit = units.unitLabel(kind);
  return (
    <div className={compact ? "" : "min-w-0"}>
      {compact ? null : (
        <label htmlFor={id} className="field-label">
          {label} {unit ? <span className="font-normal normal-case tracking-normal text-basalt-400">({unit})</span> : null}
        </label>
      )}
      <FieldCommentMarker name={name} />
      <input
        id={id}
        name={name}
        inputMode="decimal"
        aria-label={compact ? `${label}${unit ? ` (${unit})` : ""}` : undefined}
        aria-invalid={Boolean(error)}
        readOnly={readOnly}
        className={`field-input font-mono ${compact ? "px-1.5 py-1 text-xs" : ""} ${error ? "border-brick-500" : ""} ${readOnly ? "bg-grout-100" : ""}`}
        value={shown}
        onFocus={() => {
          setText(units.toDisplayText(kind, si));
          setFocused(true);
        }}
        onChange={(e) => {
          markInput(e.timeStamp);
          setText(e.target.value);
          const parsed = units.fromDisplayText(kind, e.target.value);
          void setFieldValue(name, parsed, true);
        }}
        onBlur={() => {
          setFocused(false);
          void setFieldTouched(name, true, true);
        }}
      />
      {hint && !compact ? <p className="mt-1 text-2xs text-basalt-400">{hint}</p> : null}
      {error ? (
        <p className="field-error" role="alert">
          {error}
        </p>
      ) : null}
    </div>
  );
}
