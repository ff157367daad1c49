"use client";

import { validateYupSchema, yupToFormErrors, type FormikErrors, type FormikValues } from "formik";
import { useEffect } from "react";
import type { AnyObjectSchema } from "yup";

type IdleHandle = { cancel: () => void };

function whenIdle(run: () => void, timeoutMs: number): IdleHandle {
  if (typeof requestIdleCallback === "function") {
    const id = requestIdleCallback(run, { timeout: timeoutMs });
    return { cancel: () => cancelIdleCallback(id) };
  }
  const id = setTimeout(run, 0);
  return { cancel: () => clearTimeout(id) };
}

/** At the latest this long after a change the whole form has been validated again. */
export const VALIDATE_AFTER_TYPING_MS = 150;

/**
 * The whole form's validation, off the keystroke (issue 15 item 2). The number fields set their
 * value without formik's validation on change (which marks the form validating and back: two
 * more renders of every field per keystroke); this validates the values as they stand once the
 * main thread is idle (at the latest VALIDATE_AFTER_TYPING_MS later; a newer change cancels an
 * older run), exactly as formik does (validateYupSchema: every error at once, blanks as
 * undefined) and hands the errors to setErrors, which renders nothing when they are unchanged.
 * Touching a field (blur) and the other inputs still validate through formik at once.
 */
export function useValidateAfterTyping<V extends FormikValues>(values: V, schema: AnyObjectSchema, setErrors: (errors: FormikErrors<V>) => void): void {
  useEffect(() => {
    let live = true;
    const handle = whenIdle(() => {
      validateYupSchema(values, schema).then(
        () => {
          if (live) setErrors({});
        },
        (e: unknown) => {
          // formik's own test for a schema's failure; anything else is a fault of the schema, which formik's validation reports
          if (live && (e as { name?: unknown } | null)?.name === "ValidationError") setErrors(yupToFormErrors<V>(e));
        },
      );
    }, VALIDATE_AFTER_TYPING_MS);
    return () => {
      live = false;
      handle.cancel();
    };
  }, [values, schema, setErrors]);
}
