"use client";

import { useActionState, useSyncExternalStore } from "react";
import { FormMessage, SubmitButton, TextField, type FormState } from "../../_components/form-kit";
import { signInAction } from "../actions";

const noSubscription = () => () => {};

export function SignInForm() {
  const [state, action] = useActionState(signInAction as unknown as (s: FormState, f: FormData) => Promise<FormState>, null);
  // The page is prerendered, so `?next=` is read here from the address (the action keeps only a path on this site).
  // (null while prerendering and hydrating, then the address's value: the address does not change on this page)
  const next = useSyncExternalStore(
    noSubscription,
    () => new URLSearchParams(window.location.search).get("next"),
    () => null,
  );
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
