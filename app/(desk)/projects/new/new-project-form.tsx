"use client";

import { useActionState } from "react";
import { FormMessage, SubmitButton, TextField, type FormState } from "../../../_components/form-kit";
import { createProjectAction } from "../../actions";

export function NewProjectForm() {
  const [state, action] = useActionState(createProjectAction as unknown as (s: FormState, f: FormData) => Promise<FormState>, null);
  return (
    <form action={action} className="grid grid-cols-1 gap-3 sm:grid-cols-2" noValidate>
      <TextField name="code" label="Project code" state={state} required />
      <TextField name="name" label="Name" state={state} required />
      <TextField name="client" label="Client" state={state} />
      <TextField name="site" label="Site" state={state} />
      <div>
        <label htmlFor="f-units" className="field-label">
          Units
        </label>
        <select id="f-units" name="units" className="field-input" defaultValue="si">
          <option value="si">SI (kN, m, kPa)</option>
          <option value="us">US customary (kip, ft, ksf)</option>
        </select>
      </div>
      <div className="sm:col-span-2">
        <FormMessage state={state} />
        <div className="mt-2">
          <SubmitButton>Create project</SubmitButton>
        </div>
      </div>
    </form>
  );
}
