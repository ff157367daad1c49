import Link from "next/link";
import { revisionStatusLabels, type RevisionStatus } from "@/modules/revisions";

const tone: Record<RevisionStatus, string> = {
  "in-check": "bg-ochre-100 text-ochre-700",
  checked: "bg-ochre-100 text-moss-700",
  returned: "bg-brick-100 text-brick-700",
  approved: "bg-moss-100 text-moss-700",
  superseded: "bg-basalt-100 text-basalt-600",
};

export function RevisionStatusTag({ status }: { status: RevisionStatus }) {
  return (
    <span className={`tag ${tone[status]}`} data-testid="revision-status">
      {revisionStatusLabels[status]}
    </span>
  );
}

export function formatStamp(d: Date): string {
  return d.toISOString().slice(0, 16).replace("T", " ") + " UTC";
}

/** project / foundation / revisions, above every revision page's heading. */
/** `workspace`: link the tag to the workspace (the draft), for readers who may read drafts; not the client. */
export function RevisionCrumbs({
  projectId,
  projectCode,
  foundationId,
  tag,
  revisionsHref,
  workspace = true,
}: {
  projectId: string;
  projectCode: string;
  foundationId: string;
  tag: string;
  revisionsHref?: string;
  workspace?: boolean;
}) {
  return (
    <p className="text-xs text-basalt-500">
      <Link href={`/projects/${projectId}`}>{projectCode}</Link> / {workspace ? <Link href={`/projects/${projectId}/foundations/${foundationId}`}>{tag}</Link> : tag} /{" "}
      {revisionsHref ? <Link href={revisionsHref}>revisions</Link> : "revisions"}
    </p>
  );
}

export function RevisionSelect({ name, label, revisions, defaultValue }: { name: string; label: string; revisions: { id: string; label: string }[]; defaultValue?: string }) {
  return (
    <label className="text-xs">
      <span className="field-label">{label}</span>
      <select name={name} className="field-input w-auto" defaultValue={defaultValue}>
        {revisions.map((r) => (
          <option key={r.id} value={r.id}>
            {r.label}
          </option>
        ))}
      </select>
    </label>
  );
}
