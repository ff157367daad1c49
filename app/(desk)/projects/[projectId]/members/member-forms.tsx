"use client";

import { useActionState } from "react";
import { projectRoles } from "@/modules/platform/permissions";
import { fieldErrorsOf, FormMessage, SubmitButton, TextField, type FormState } from "../../../../_components/form-kit";
import { inviteMemberAction, removeMemberAction } from "../../../actions";

type Act = (s: FormState, f: FormData) => Promise<FormState>;

export function InviteForm({ projectId }: { projectId: string }) {
  const [state, action] = useActionState(inviteMemberAction as unknown as Act, null);
  const roleErrors = fieldErrorsOf(state, "role");
  return (
    <form action={action} className="mt-3 grid grid-cols-1 gap-3 sm:grid-cols-2" noValidate>
      <input type="hidden" name="projectId" value={projectId} />
      <TextField name="name" label="Name" state={state} required />
      <TextField name="email" label="E-mail" type="email" state={state} required />
      <div>
        <label htmlFor="f-role" className="field-label">
          Role
        </label>
        <select id="f-role" name="role" className="field-input" defaultValue="designer">
          {projectRoles.map((r) => (
            <option key={r} value={r}>
              {r}
            </option>
          ))}
        </select>
        {roleErrors.map((e) => (
          <p key={e} className="field-error">
            {e}
          </p>
        ))}
      </div>
      <TextField name="company" label="Company (vendors)" state={state} />
      <div className="sm:col-span-2">
        <FormMessage state={state && state.ok ? { ok: true, message: "Invitation sent." } : state} />
        <div className="mt-2">
          <SubmitButton>Send invitation</SubmitButton>
        </div>
      </div>
    </form>
  );
}

export function RemoveMemberButton({ projectId, memberId, name }: { projectId: string; memberId: string; name: string }) {
  const [state, action] = useActionState(removeMemberAction as unknown as Act, null);
  return (
    <form action={action}>
      <input type="hidden" name="projectId" value={projectId} />
      <input type="hidden" name="memberId" value={memberId} />
      <button type="submit" className="btn-danger px-2 py-0.5 text-xs" aria-label={`Remove ${name}`}>
        Remove
      </button>
      {state && !state.ok ? <p className="field-error">{state.message}</p> : null}
    </form>
  );
}
