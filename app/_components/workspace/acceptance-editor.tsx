"use client";

import { useFormikContext } from "formik";
import { useState } from "react";
import { ACCEPTANCE_JUSTIFICATION_MAX, ACCEPTANCE_JUSTIFICATION_MIN, type CheckResult } from "@/modules/calc";
import { withAcceptance, type DraftForm } from "@/modules/desk/draft-form";

/**
 * Beside a failing soil-band check: the designer's written justification for accepting it. It
 * goes into the input's `acceptances` (saved with the draft, frozen in the revision); the check
 * stays failed and reads "accepted with justification". A blank text withdraws the acceptance.
 */
export function AcceptanceEditor({ check }: { check: CheckResult }) {
  const { values, setFieldValue, status } = useFormikContext<DraftForm>();
  const key = check.key ?? "";
  const index = values.acceptances.findIndex((a) => a.checkKey === key);
  const text = index < 0 ? "" : (values.acceptances[index]?.justification ?? "");
  const [open, setOpen] = useState(text !== "");
  const trimmed = text.trim().length;
  const serverIssue = index < 0 ? undefined : (status as { serverIssues?: Record<string, string> } | undefined)?.serverIssues?.[`acceptances[${index}].justification`];
  const tooShort = trimmed > 0 && trimmed < ACCEPTANCE_JUSTIFICATION_MIN;
  if (!check.soilCase || check.pass || !key) return null;
  if (!open) {
    return (
      <button type="button" className="btn-quiet mt-1 text-2xs" onClick={() => setOpen(true)} data-testid="accept-band-check">
        accept with justification…
      </button>
    );
  }
  const id = `acceptance-${key.replace(/[^a-zA-Z0-9]+/g, "-")}`;
  return (
    <div className="mt-1 w-64">
      <label htmlFor={id} className="block text-2xs text-basalt-600">
        Justification for accepting this band exceedance (recorded in the revision)
      </label>
      <textarea
        id={id}
        className="w-full text-xs"
        rows={3}
        maxLength={ACCEPTANCE_JUSTIFICATION_MAX}
        value={text}
        data-testid="acceptance-justification"
        aria-invalid={tooShort || Boolean(serverIssue)}
        onChange={(e) => void setFieldValue("acceptances", withAcceptance(values.acceptances, key, e.target.value))}
      />
      {tooShort || serverIssue ? (
        <p className="text-2xs text-brick-700">{serverIssue ?? `At least ${ACCEPTANCE_JUSTIFICATION_MIN} characters (${trimmed} so far), or clear it.`}</p>
      ) : (
        <p className="text-2xs text-basalt-500">The check stays failed; clear the text to withdraw the acceptance.</p>
      )}
    </div>
  );
}
