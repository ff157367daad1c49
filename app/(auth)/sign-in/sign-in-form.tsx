"use client";

import { useActionState } from "react";
import { FormMessage, SubmitButton, TextField, type FormState } from "../../_components/form-kit";
import { signInAction } from "../actions";

export function SignInForm({ next }: { next?: string }) {
  const [state, action] = useActionState(signInAction as unknown as (s: FormState, f: FormData) => Promise<FormState>, null);
  return (
    <form action={action} className="space-y-4" noValidate>
      {next ? <input type="hidden" name="next" value={next} /> : null}
      <TextField name="email" label="E-mail" type="email" autoComplete="username" state={state} required />
      <TextField name="password" label="Password" type="password" autoComplete="current-password" state={state} required />
      <FormMessage state={state} />
      <SubmitButton>Sign in</SubmitButton>
    </form>
  );
}
