"use client";

import { useActionState } from "react";
import { FormMessage, SubmitButton, TextField, type FormState } from "../../_components/form-kit";
import { forgotPasswordAction } from "../actions";

export function ForgotPasswordForm() {
  const [state, action] = useActionState(forgotPasswordAction as unknown as (s: FormState, f: FormData) => Promise<FormState>, null);
  if (state?.ok) {
    return (
      <p className="rounded-plinth border border-moss-500 bg-moss-100 px-3 py-2 text-sm text-moss-700" role="status">
        If that address has an account, a reset link is on its way.
      </p>
    );
  }
  return (
    <form action={action} className="space-y-4" noValidate>
      <TextField name="email" label="E-mail" type="email" autoComplete="username" state={state} required />
      <FormMessage state={state} />
      <SubmitButton>Send the link</SubmitButton>
    </form>
  );
}
