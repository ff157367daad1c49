"use client";

import { useActionState } from "react";
import { FormMessage, SubmitButton, TextField, type FormState } from "../../../_components/form-kit";
import { restoreFoundationAction, withdrawFoundationAction } from "../../actions";

type Action = (s: FormState, f: FormData) => Promise<FormState>;

/** The manager's way to take a foundation created by mistake off the project table and the register. */
export function WithdrawFoundationForm({ projectId, foundationId, tag }: { projectId: string; foundationId: string; tag: string }) {
  const [state, action] = useActionState(withdrawFoundationAction as unknown as Action, null);
  return (
    <details className="slab max-w-2xl p-4" data-testid="withdraw-foundation">
      <summary className="cursor-pointer text-sm font-semibold text-basalt-700">Withdraw {tag}</summary>
      <p className="mt-2 text-sm text-basalt-600">
        A withdrawn foundation leaves the project table and the register. Its issued revisions and its audit trail are kept, managers can still read them, and it can be
        restored.
      </p>
      <form action={action} className="mt-3 space-y-3" noValidate>
        <input type="hidden" name="projectId" value={projectId} />
        <input type="hidden" name="foundationId" value={foundationId} />
        <TextField name="reason" label="Why it is withdrawn" state={state} required />
        <FormMessage state={state} />
        <SubmitButton className="btn-danger">Withdraw the foundation</SubmitButton>
      </form>
    </details>
  );
}

export function RestoreFoundationButton({ projectId, foundationId, tag }: { projectId: string; foundationId: string; tag: string }) {
  const [state, action] = useActionState(restoreFoundationAction as unknown as Action, null);
  return (
    <form action={action} className="inline-flex items-center gap-2">
      <input type="hidden" name="projectId" value={projectId} />
      <input type="hidden" name="foundationId" value={foundationId} />
      <SubmitButton className="btn-quiet">Restore {tag}</SubmitButton>
      <FormMessage state={state && state.ok ? { ok: true, message: `${tag} is restored.` } : state} />
    </form>
  );
}
