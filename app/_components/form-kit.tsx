"use client";

import { useFormStatus } from "react-dom";
import type { ReactNode } from "react";

export type FormState =
  | { ok: true; message?: string; data?: unknown }
  | { ok: false; code: string; message: string; fieldErrors?: Record<string, string[]> }
  | null;

export function fieldErrorsOf(state: FormState, name: string): string[] {
  if (!state || state.ok) return [];
  return state.fieldErrors?.[name] ?? [];
}

export function TextField(props: {
  name: string;
  label: string;
  state: FormState;
  type?: string;
  defaultValue?: string;
  autoComplete?: string;
  required?: boolean;
  hint?: ReactNode;
}) {
  const errors = fieldErrorsOf(props.state, props.name);
  const id = `f-${props.name}`;
  return (
    <div>
      <label htmlFor={id} className="field-label">
        {props.label}
      </label>
      <input
        id={id}
        name={props.name}
        type={props.type ?? "text"}
        defaultValue={props.defaultValue}
        autoComplete={props.autoComplete}
        required={props.required}
        aria-invalid={errors.length > 0}
        aria-describedby={errors.length ? `${id}-err` : undefined}
        className="field-input"
      />
      {props.hint ? <p className="mt-1 text-xs text-basalt-400">{props.hint}</p> : null}
      <div id={`${id}-err`} aria-live="polite">
        {errors.map((e) => (
          <p key={e} className="field-error">
            {e}
          </p>
        ))}
      </div>
    </div>
  );
}

export function FormMessage({ state }: { state: FormState }) {
  return (
    <div aria-live="polite" role="status">
      {state && !state.ok ? (
        <p className="rounded-plinth border border-brick-500 bg-brick-100 px-3 py-2 text-sm text-brick-700" data-testid="form-error">
          {state.message}
        </p>
      ) : null}
      {state && state.ok && state.message ? (
        <p className="rounded-plinth border border-moss-500 bg-moss-100 px-3 py-2 text-sm text-moss-700">{state.message}</p>
      ) : null}
    </div>
  );
}

export function SubmitButton({ children, className }: { children: ReactNode; className?: string }) {
  const { pending } = useFormStatus();
  return (
    <button type="submit" className={className ?? "btn-primary"} disabled={pending} aria-busy={pending}>
      {pending ? "Working…" : children}
    </button>
  );
}
