"use client";

import { useActionState } from "react";
import { FormMessage, SubmitButton, TextField, type FormState } from "../_components/form-kit";
import { acceptInvitationAction, resetPasswordAction } from "./actions";

export function PasswordForm({ token, mode, defaultName }: { token: string; mode: "reset" | "invite"; defaultName?: string }) {
  const act = (mode === "reset" ? resetPasswordAction : acceptInvitationAction) as unknown as (s: FormState, f: FormData) => Promise<FormState>;
  const [state, action] = useActionState(act, null);
  return (
    <form action={action} className="space-y-4" noValidate>
      <input type="hidden" name="token" value={token} />
      {mode === "invite" ? <TextField name="name" label="Your name" state={state} defaultValue={defaultName} required /> : null}
      <TextField name="password" label="New password" type="password" autoComplete="new-password" state={state} hint="At least 10 characters." required />
      <TextField name="confirm" label="Repeat it" type="password" autoComplete="new-password" state={state} required />
      <FormMessage state={state} />
      <SubmitButton>{mode === "reset" ? "Save and sign in" : "Set password and open the project"}</SubmitButton>
    </form>
  );
}
