"use client";

import { createContext, useContext, type ReactNode } from "react";
import { fieldLabel } from "@/modules/revisions/field-labels";

// On a revision page a checker comments on a value by choosing it. The page provides the
// chooser; everywhere else (the workspace) there is none and values render as plain text.
const FieldPickContext = createContext<((path: string) => void) | null>(null);

export const FieldPickProvider = FieldPickContext.Provider;

/** A value one may comment on: a button when a chooser is provided, else its children as they are. */
export function FieldPick({ path, children }: { path: string; children: ReactNode }) {
  const pick = useContext(FieldPickContext);
  if (!pick) return <>{children}</>;
  const label = fieldLabel(path);
  return (
    <button
      type="button"
      className="rounded-plinth text-left underline decoration-dotted decoration-basalt-300 underline-offset-2 hover:bg-ochre-100 focus-visible:bg-ochre-100"
      // The value stays the button's accessible name (what it shows); the title says what it does.
      title={`Comment on ${label}`}
      data-field-path={path}
      onClick={() => pick(path)}
    >
      {children}
    </button>
  );
}
