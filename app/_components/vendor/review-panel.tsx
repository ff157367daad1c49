"use client";

import { useActionState } from "react";
import { FormMessage, SubmitButton, fieldErrorsOf, type FormState } from "../form-kit";
import type { ServerAction } from "../../_lib/action";

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- each action has its own data type
type AnyAction = ServerAction<any>;

/** Take a version into the draft (at the draft version the page was rendered with) or return it. */
export function ReviewPanel({
  projectId,
  submissionId,
  draftVersion,
  accept,
  giveBack,
}: {
  projectId: string;
  submissionId: string;
  draftVersion: number;
  accept: AnyAction;
  giveBack: AnyAction;
}) {
  const [acceptState, acceptAction] = useActionState(accept as (s: FormState, f: FormData) => Promise<FormState>, null);
  const [returnState, returnAction] = useActionState(giveBack as (s: FormState, f: FormData) => Promise<FormState>, null);
  const commentErrors = fieldErrorsOf(returnState, "comment");
  return (
    <div className="grid gap-4 md:grid-cols-2">
      <form action={acceptAction} className="space-y-2">
        <input type="hidden" name="projectId" value={projectId} />
        <input type="hidden" name="submissionId" value={submissionId} />
        <input type="hidden" name="draftVersion" value={draftVersion} />
        <p className="text-sm text-basalt-600">
          {draftVersion === 0
            ? "The foundation has no saved draft yet: this starts one with these machines and the workspace's starting block; soil and criteria are then still to be entered."
            : <>Replaces the machines of the foundation&apos;s draft (version {draftVersion}) with this version&apos;s; block, soil and criteria stay as they are.</>}
        </p>
        <SubmitButton>Take into draft</SubmitButton>
        <FormMessage state={acceptState} />
      </form>
      <form action={returnAction} className="space-y-2">
        <input type="hidden" name="projectId" value={projectId} />
        <input type="hidden" name="submissionId" value={submissionId} />
        <label htmlFor={`comment-${submissionId}`} className="field-label">
          Comment to the vendor
        </label>
        <textarea id={`comment-${submissionId}`} name="comment" rows={3} className="field-input" aria-invalid={commentErrors.length > 0} />
        {commentErrors.map((e) => (
          <p key={e} className="field-error">
            {e}
          </p>
        ))}
        <SubmitButton className="btn-quiet">Return to vendor</SubmitButton>
        <FormMessage state={returnState} />
      </form>
    </div>
  );
}
