"use client";

import { useActionState } from "react";
import { FormMessage, SubmitButton, TextField, type FormState } from "../../../_components/form-kit";
import { createFoundationAction } from "../../actions";

export function NewFoundationForm({ projectId }: { projectId: string }) {
  const [state, action] = useActionState(createFoundationAction as unknown as (s: FormState, f: FormData) => Promise<FormState>, null);
  return (
    <form action={action} className="mt-3 grid grid-cols-1 gap-3 sm:grid-cols-3" noValidate>
      <input type="hidden" name="projectId" value={projectId} />
      <TextField name="tag" label="Tag" state={state} required />
      <TextField name="machineTrain" label="Machine train" state={state} />
      <TextField name="location" label="Location" state={state} />
      <div className="sm:col-span-3">
        <FormMessage state={state && state.ok ? { ok: true, message: "Foundation added." } : state} />
        <div className="mt-2">
          <SubmitButton>Add foundation</SubmitButton>
        </div>
      </div>
    </form>
  );
}
