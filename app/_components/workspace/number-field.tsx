"use client";

import { getIn, useFormikContext } from "formik";
import { memo, useId, useState } from "react";
import { useUnits, type QuantityKey } from "./units-context";
import { FieldCommentMarker } from "./review-comments";
import { markInput } from "./input-timing";

interface NumberFieldProps {
  name: string;
  label: string;
  kind: QuantityKey;
  hint?: string;
  readOnly?: boolean;
  compact?: boolean;
}

/**
 * A numeric input bound to a formik field that holds the SI value. It shows and
 * takes the value in the user's display units; what is stored stays SI.
 *
 * Typing cost (issue 15 item 2): every consumer of formik's context renders on each change of
 * the form, so this outer part only reads the field's own slice (value, shown error) and the
 * input below is memoised on it: a keystroke renders the one field typed into, not all of them
 * (the same idea as formik's FastField, with the server's issues taken into account).
 */
export function NumberField(props: NumberFieldProps) {
  const formik = useFormikContext<Record<string, unknown>>();
  const { name } = props;
  const si = getIn(formik.values, name) as number | null | undefined;
  const clientError = getIn(formik.touched, name) ? (getIn(formik.errors, name) as unknown) : undefined;
  const serverError = (formik.status as { serverIssues?: Record<string, string> } | undefined)?.serverIssues?.[name];
  const error = typeof clientError === "string" ? clientError : serverError;
  // setFieldValue and setFieldTouched keep their identity across renders (formik's event callbacks)
  return <NumberInput {...props} si={si} error={error} setFieldValue={formik.setFieldValue} setFieldTouched={formik.setFieldTouched} />;
}

type FormikApi = ReturnType<typeof useFormikContext<Record<string, unknown>>>;

const NumberInput = memo(
  function NumberInput({
    name,
    label,
    kind,
    hint,
    readOnly,
    compact,
    si,
    error,
    setFieldValue,
    setFieldTouched,
  }: NumberFieldProps & { si: number | null | undefined; error: string | undefined; setFieldValue: FormikApi["setFieldValue"]; setFieldTouched: FormikApi["setFieldTouched"] }) {
    const units = useUnits();
    // While the field has focus it shows exactly what is typed; otherwise the stored SI value in display units.
    const [text, setText] = useState("");
    const [focused, setFocused] = useState(false);
    const id = useId();
    const shown = focused ? text : units.toDisplayText(kind, si);
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
            // Without formik's validation on change (the workspace's Formik has it off too): it
            // flips isValidating and back, two more renders of every field per keystroke. The
            // workspace validates the whole form when the main thread is idle (use-validate-after-typing.ts).
            void setFieldValue(name, parsed, false);
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
  },
);
