"use client";

import Link from "next/link";
import { useActionState, useState } from "react";
import { FormMessage, SubmitButton, TextField, fieldErrorsOf, type FormState } from "../form-kit";
import type { ServerAction } from "../../_lib/action";

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- each action has its own data type
type AnyAction = ServerAction<any>;

export interface FoundationChoice {
  id: string;
  tag: string;
  machineNames: string[];
}

export interface ContactChoiceView {
  userId: string;
  label: string;
}

/**
 * The designer's request: a foundation, its machines, and a vendor member of the project.
 * Only a manager (mayInvite) may name a new contact, who is then invited as a member; the
 * action checks that itself, the missing option only saves a designer a refusal.
 */
export function SendRequestForm({
  projectId,
  foundations,
  contacts,
  mayInvite,
  teamHref,
  action,
}: {
  projectId: string;
  foundations: FoundationChoice[];
  contacts: ContactChoiceView[];
  mayInvite: boolean;
  teamHref: string;
  action: AnyAction;
}) {
  const [state, formAction] = useActionState(action as (s: FormState, f: FormData) => Promise<FormState>, null);
  const [foundationId, setFoundationId] = useState(foundations[0]?.id ?? "");
  const [contact, setContact] = useState(contacts[0] ? `member:${contacts[0].userId}` : mayInvite ? "new" : "");
  if (!mayInvite && contacts.length === 0) {
    return (
      <p className="text-sm text-basalt-500" data-testid="no-vendor-contacts">
        No vendor is on this project yet. The project&apos;s manager invites vendor contacts on the <Link href={teamHref}>Team</Link> page; they then appear here.
      </p>
    );
  }
  const machines = foundations.find((f) => f.id === foundationId)?.machineNames.join("\n") ?? "";
  return (
    <form action={formAction} className="space-y-3" data-testid="send-request-form">
      <input type="hidden" name="projectId" value={projectId} />
      <div className="grid gap-3 md:grid-cols-2">
        <label className="block">
          <span className="field-label">Foundation</span>
          <select name="foundationId" className="field-input" value={foundationId} onChange={(e) => setFoundationId(e.target.value)}>
            {foundations.map((f) => (
              <option key={f.id} value={f.id}>
                {f.tag}
              </option>
            ))}
          </select>
        </label>
        <label className="block">
          <span className="field-label">Vendor contact</span>
          <select name="contact" className="field-input" value={contact} onChange={(e) => setContact(e.target.value)}>
            {contacts.map((c) => (
              <option key={c.userId} value={`member:${c.userId}`}>
                {c.label}
              </option>
            ))}
            {mayInvite ? <option value="new">New contact (invite by e-mail as a member)…</option> : null}
          </select>
          {mayInvite ? null : <span className="text-2xs text-basalt-400">Someone else? The project&apos;s manager invites vendor contacts on the Team page.</span>}
        </label>
      </div>
      {contact === "new" ? (
        <div className="grid gap-3 md:grid-cols-3">
          <TextField name="newEmail" label="Contact e-mail" type="email" state={state} />
          <TextField name="newName" label="Contact name" state={state} />
          <TextField name="newCompany" label="Vendor company" state={state} />
        </div>
      ) : null}
      <label className="block">
        <span className="field-label">Machines asked for (one per line; names as in the draft prefill their figures)</span>
        <textarea key={foundationId} name="machineNames" rows={3} className="field-input font-mono" defaultValue={machines} />
        {fieldErrorsOf(state, "machineNames").map((e) => (
          <span key={e} className="field-error block">
            {e}
          </span>
        ))}
      </label>
      <div className="grid gap-3 md:grid-cols-[1fr_12rem]">
        <TextField name="message" label="Note to the vendor" state={state} />
        <TextField name="dueOn" label="Wanted by" type="date" state={state} />
      </div>
      <SubmitButton>Send data request</SubmitButton>
      <FormMessage state={state} />
    </form>
  );
}
