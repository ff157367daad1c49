"use client";

import { useActionState, useRef } from "react";
import { useFormStatus } from "react-dom";
import { FormMessage, SubmitButton, fieldErrorsOf, type FormState } from "@/app/_components/form-kit";
// Not the module index: it re-exports the input hash (node:crypto), which would pull Node polyfills that eval into the browser bundle.
import { REVISION_PURPOSES, revisionPurposeLabels } from "@/modules/revisions/status";
import { commentOnRevisionAction, decideRevisionAction, issueRevisionAction, resolveRevisionCommentAction, shareRevisionAction } from "./actions";

type Act = (s: FormState, f: FormData) => Promise<FormState>;

function okMessage(state: FormState): FormState {
  if (state && state.ok) {
    const data = state.data as { message?: string } | undefined;
    return { ok: true, message: data?.message ?? state.message ?? "Done." };
  }
  return state;
}

function FieldErrors({ state, name }: { state: FormState; name: string }) {
  return (
    <div aria-live="polite">
      {fieldErrorsOf(state, name).map((e) => (
        <p key={e} className="field-error">
          {e}
        </p>
      ))}
    </div>
  );
}

/**
 * Issue the saved draft (at the version shown) for check, with the revision note. When the
 * draft's checks fail, a confirmation names them first; issuing stays allowed (a checker may
 * be asked to accept a margin), but never without the designer having seen the list.
 */
export function IssueForm({ projectId, foundationId, draftVersion, failingChecks = [] }: { projectId: string; foundationId: string; draftVersion: number; failingChecks?: string[] }) {
  const [state, action] = useActionState(issueRevisionAction as unknown as Act, null);
  const confirm = useRef<HTMLDialogElement>(null);
  return (
    <form action={action} className="space-y-2" noValidate onSubmit={() => confirm.current?.close()}>
      <input type="hidden" name="projectId" value={projectId} />
      <input type="hidden" name="foundationId" value={foundationId} />
      <input type="hidden" name="draftVersion" value={draftVersion} />
      <label className="field-label" htmlFor="issue-purpose">
        Purpose of the issue
      </label>
      <select id="issue-purpose" name="purpose" defaultValue="issued-for-check" className="field-input" data-testid="issue-purpose">
        {REVISION_PURPOSES.map((p) => (
          <option key={p} value={p}>
            {revisionPurposeLabels[p]}
          </option>
        ))}
      </select>
      <FieldErrors state={state} name="purpose" />
      <label className="field-label" htmlFor="revision-note">
        Revision note: what changed and why
      </label>
      <textarea id="revision-note" name="note" rows={3} required className="field-input" aria-invalid={fieldErrorsOf(state, "note").length > 0} />
      <FieldErrors state={state} name="note" />
      <FormMessage state={okMessage(state)} />
      <FieldErrors state={state} name="draftVersion" />
      {failingChecks.length ? (
        <>
          <button type="button" className="btn-primary" onClick={() => confirm.current?.showModal()}>
            Issue for check
          </button>
          <dialog ref={confirm} className="slab max-w-lg space-y-3 p-5" aria-labelledby="issue-failing-heading" data-testid="issue-failing-dialog">
            <h3 id="issue-failing-heading">
              {failingChecks.length} {failingChecks.length === 1 ? "check fails" : "checks fail"} on this draft
            </h3>
            <ul className="list-disc space-y-1 pl-5 text-sm" data-testid="issue-failing-checks">
              {failingChecks.map((c) => (
                <li key={c}>{c}</li>
              ))}
            </ul>
            <p className="text-sm text-basalt-600">Issue it anyway for the checker to see with these failures, or go back and change the draft.</p>
            <div className="flex gap-2">
              <button type="button" className="btn-quiet" onClick={() => confirm.current?.close()}>
                Go back
              </button>
              <SubmitButton>Issue anyway</SubmitButton>
            </div>
          </dialog>
        </>
      ) : (
        <SubmitButton>Issue for check</SubmitButton>
      )}
    </form>
  );
}

function DecisionButton({ outcome, children, className }: { outcome: "checked" | "returned" | "approved"; children: string; className: string }) {
  const { pending } = useFormStatus();
  return (
    <button type="submit" name="outcome" value={outcome} className={className} disabled={pending} aria-busy={pending}>
      {children}
    </button>
  );
}

/**
 * The checker's (or manager's) verdict on a revision in check. `step`: "approve" offers the
 * approval (one step, or the second of two); "check" the first signature of two steps.
 */
export function DecisionForm({ projectId, foundationId, revisionId, step = "approve" }: { projectId: string; foundationId: string; revisionId: string; step?: "check" | "approve" }) {
  const [state, action] = useActionState(decideRevisionAction as unknown as Act, null);
  return (
    <form action={action} className="space-y-2" noValidate>
      <input type="hidden" name="projectId" value={projectId} />
      <input type="hidden" name="foundationId" value={foundationId} />
      <input type="hidden" name="revisionId" value={revisionId} />
      <label className="field-label" htmlFor="decision-note">
        Note to the designer (needed to return)
      </label>
      <textarea id="decision-note" name="note" rows={3} className="field-input" aria-invalid={fieldErrorsOf(state, "note").length > 0} />
      <FieldErrors state={state} name="note" />
      <FormMessage state={okMessage(state)} />
      <div className="flex gap-2">
        <DecisionButton outcome="returned" className="btn-danger">
          Return with comments
        </DecisionButton>
        {step === "check" ? (
          <DecisionButton outcome="checked" className="btn-primary">
            Mark checked (approval follows by someone else)
          </DecisionButton>
        ) : (
          <DecisionButton outcome="approved" className="btn-primary">
            Approve revision
          </DecisionButton>
        )}
      </div>
    </form>
  );
}

/**
 * A new comment on the revision or on one field of it, or an answer to a comment. The field is
 * chosen on the page (a value, a check row) and arrives as `fieldPath`; nobody types a path.
 */
export function CommentForm({
  projectId,
  foundationId,
  revisionId,
  parentId,
  fieldPath,
  idPrefix,
}: {
  projectId: string;
  foundationId: string;
  revisionId: string;
  parentId?: string;
  fieldPath?: string;
  idPrefix?: string;
}) {
  const [state, action] = useActionState(commentOnRevisionAction as unknown as Act, null);
  const id = idPrefix ?? (parentId ? `answer-${parentId}` : "new-comment");
  return (
    <form action={action} className="space-y-2" noValidate key={state && state.ok ? String((state.data as { commentId?: string })?.commentId) : "form"}>
      <input type="hidden" name="projectId" value={projectId} />
      <input type="hidden" name="foundationId" value={foundationId} />
      <input type="hidden" name="revisionId" value={revisionId} />
      {parentId ? <input type="hidden" name="parentId" value={parentId} /> : null}
      {!parentId && fieldPath ? <input type="hidden" name="fieldPath" value={fieldPath} /> : null}
      <FieldErrors state={state} name="fieldPath" />
      <label className="field-label" htmlFor={`${id}-body`}>
        {parentId ? "Answer" : "Comment"}
      </label>
      <textarea id={`${id}-body`} name="body" rows={parentId ? 2 : 3} className="field-input" aria-invalid={fieldErrorsOf(state, "body").length > 0} />
      <FieldErrors state={state} name="body" />
      <FormMessage state={okMessage(state)} />
      <SubmitButton className={parentId ? "btn-quiet" : "btn-primary"}>{parentId ? "Post answer" : "Post comment"}</SubmitButton>
    </form>
  );
}

export function ResolveButton({ projectId, foundationId, commentId, resolved }: { projectId: string; foundationId: string; commentId: string; resolved: boolean }) {
  const [state, action] = useActionState(resolveRevisionCommentAction as unknown as Act, null);
  return (
    <form action={action} className="inline">
      <input type="hidden" name="projectId" value={projectId} />
      <input type="hidden" name="foundationId" value={foundationId} />
      <input type="hidden" name="commentId" value={commentId} />
      <input type="hidden" name="resolved" value={resolved ? "false" : "true"} />
      <SubmitButton className="btn-quiet px-2 py-0.5 text-xs">{resolved ? "Open again" : "Mark resolved"}</SubmitButton>
      {state && !state.ok ? <span className="field-error ml-2">{state.message}</span> : null}
    </form>
  );
}

/** A manager shares an unapproved revision's package with the client, or withdraws the share. */
export function ShareForm({ projectId, foundationId, revisionId, shared }: { projectId: string; foundationId: string; revisionId: string; shared: boolean }) {
  const [state, action] = useActionState(shareRevisionAction as unknown as Act, null);
  return (
    <form action={action} className="inline" data-testid="share-form">
      <input type="hidden" name="projectId" value={projectId} />
      <input type="hidden" name="foundationId" value={foundationId} />
      <input type="hidden" name="revisionId" value={revisionId} />
      <input type="hidden" name="shared" value={shared ? "false" : "true"} />
      <SubmitButton className="btn-quiet px-2 py-0.5 text-xs">{shared ? "Stop sharing with the client" : "Share the package with the client"}</SubmitButton>
      {state && !state.ok ? <span className="field-error ml-2">{state.message}</span> : null}
    </form>
  );
}
