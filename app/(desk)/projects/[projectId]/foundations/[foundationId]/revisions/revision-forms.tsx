"use client";

import { useActionState } from "react";
import { useFormStatus } from "react-dom";
import { FormMessage, SubmitButton, fieldErrorsOf, type FormState } from "@/app/_components/form-kit";
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

/** Issue the saved draft (at the version shown) for check. */
export function IssueForm({ projectId, foundationId, draftVersion }: { projectId: string; foundationId: string; draftVersion: number }) {
  const [state, action] = useActionState(issueRevisionAction as unknown as Act, null);
  return (
    <form action={action} className="space-y-2" noValidate>
      <input type="hidden" name="projectId" value={projectId} />
      <input type="hidden" name="foundationId" value={foundationId} />
      <input type="hidden" name="draftVersion" value={draftVersion} />
      <FormMessage state={okMessage(state)} />
      <FieldErrors state={state} name="draftVersion" />
      <SubmitButton>Issue for check</SubmitButton>
    </form>
  );
}

function DecisionButton({ outcome, children, className }: { outcome: "returned" | "approved"; children: string; className: string }) {
  const { pending } = useFormStatus();
  return (
    <button type="submit" name="outcome" value={outcome} className={className} disabled={pending} aria-busy={pending}>
      {children}
    </button>
  );
}

/** The checker's (or manager's) verdict on a revision in check. */
export function DecisionForm({ projectId, foundationId, revisionId }: { projectId: string; foundationId: string; revisionId: string }) {
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
        <DecisionButton outcome="approved" className="btn-primary">
          Approve revision
        </DecisionButton>
      </div>
    </form>
  );
}

/** A new comment on the revision or one of its fields, or an answer to a comment. */
export function CommentForm({
  projectId,
  foundationId,
  revisionId,
  parentId,
  fieldPaths,
  defaultFieldPath,
}: {
  projectId: string;
  foundationId: string;
  revisionId: string;
  parentId?: string;
  fieldPaths?: string[];
  defaultFieldPath?: string;
}) {
  const [state, action] = useActionState(commentOnRevisionAction as unknown as Act, null);
  const id = parentId ? `answer-${parentId}` : "new-comment";
  return (
    <form action={action} className="space-y-2" noValidate key={state && state.ok ? String((state.data as { commentId?: string })?.commentId) : "form"}>
      <input type="hidden" name="projectId" value={projectId} />
      <input type="hidden" name="foundationId" value={foundationId} />
      <input type="hidden" name="revisionId" value={revisionId} />
      {parentId ? <input type="hidden" name="parentId" value={parentId} /> : null}
      {!parentId && fieldPaths ? (
        <div>
          <label className="field-label" htmlFor={`${id}-field`}>
            On field (leave blank for the whole revision)
          </label>
          <input id={`${id}-field`} name="fieldPath" list={`${id}-paths`} defaultValue={defaultFieldPath} className="field-input font-mono text-xs" placeholder="e.g. soil.poissonRatio" />
          <datalist id={`${id}-paths`}>
            {fieldPaths.map((p) => (
              <option key={p} value={p} />
            ))}
          </datalist>
          <FieldErrors state={state} name="fieldPath" />
        </div>
      ) : null}
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
