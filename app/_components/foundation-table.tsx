"use client";

import Link from "next/link";
import { useMemo, useState } from "react";
import type { GoverningSummary } from "@/modules/desk/foundation-summary";
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from "@tanstack/react-table";

export interface FoundationRowView {
  id: string;
  tag: string;
  machineTrain: string;
  location: string;
  status: string;
  latestRevision: string;
  latestRevisionId: string | null;
  /** The latest approved revision, shown beside the latest issued one (it stays of record while a later one is in check). */
  latestApproved: string;
  latestApprovedId: string | null;
  /** Null when the reader does not see review comments (the client). */
  openComments: number | null;
  /** Where the tag leads: the workspace for the design team, the revisions for the client. */
  href: string;
  flags: string[];
  governing: GoverningSummary | null;
  /** The draft is saved but incomplete: "incomplete" where the verdict would be. */
  draftIncomplete?: boolean;
  updatedAt: string;
}

const col = createColumnHelper<FoundationRowView>();

export function FoundationTable({ projectId, rows, showComments = true }: { projectId: string; rows: FoundationRowView[]; showComments?: boolean }) {
  const [sorting, setSorting] = useState<SortingState>([{ id: "tag", desc: false }]);
  const [filter, setFilter] = useState("");
  const columns = useMemo(
    () => [
      col.accessor("tag", {
        header: "Tag",
        cell: (c) => (
          <Link className="font-mono font-medium" href={c.row.original.href}>
            {c.getValue()}
          </Link>
        ),
      }),
      col.accessor("machineTrain", { header: "Machine train" }),
      col.accessor("status", {
        header: "Status",
        cell: (c) => (
          <span className="space-x-1">
            <span className={`tag ${c.getValue() === "approved" ? "bg-moss-100 text-moss-700" : c.getValue().startsWith("returned") ? "bg-brick-100 text-brick-700" : "bg-basalt-100 text-basalt-700"}`}>{c.getValue()}</span>
            {c.row.original.flags.map((f) => (
              <span key={f} className="tag bg-ochre-100 text-ochre-700" data-testid="foundation-flag">
                {f}
              </span>
            ))}
          </span>
        ),
      }),
      col.accessor("latestApproved", {
        header: "Latest approved",
        cell: (c) => {
          const id = c.row.original.latestApprovedId;
          return id ? (
            <Link className="font-mono" href={`/projects/${projectId}/foundations/${c.row.original.id}/revisions/${id}`} data-testid="latest-approved">
              {c.getValue()}
            </Link>
          ) : (
            <span className="text-basalt-400">{c.getValue()}</span>
          );
        },
      }),
      col.accessor("latestRevision", {
        header: "Latest issued",
        cell: (c) => {
          const id = c.row.original.latestRevisionId;
          return id ? (
            <Link className="font-mono" href={`/projects/${projectId}/foundations/${c.row.original.id}/revisions/${id}`}>
              {c.getValue()}
            </Link>
          ) : (
            <span className="text-basalt-400">{c.getValue()}</span>
          );
        },
      }),
      ...(showComments ? [col.accessor((r) => r.openComments ?? 0, { id: "openComments", header: "Open comments", cell: (c) => <span className="font-mono">{c.getValue()}</span> })] : []),
      col.accessor((r) => r.governing?.utilisation ?? -1, {
        id: "governing",
        header: "Governing check",
        cell: (c) => {
          const g = c.row.original.governing;
          if (!g)
            return c.row.original.draftIncomplete ? (
              <span className="tag bg-ochre-100 text-ochre-700" data-verdict="incomplete">
                incomplete
              </span>
            ) : (
              <span className="text-basalt-400">no complete input</span>
            );
          return (
            <span className="text-xs">
              <span
                className={`tag mr-1.5 ${g.pass ? "bg-moss-100 text-moss-700" : g.failing > g.accepted ? "bg-brick-100 text-brick-700" : "bg-ochre-100 text-ochre-700"}`}
                data-verdict={g.verdict}
              >
                {g.pass ? "pass" : [g.failing > g.accepted ? `${g.failing - g.accepted} fail` : "", g.accepted ? `${g.accepted} accepted with justification` : ""].filter(Boolean).join(", ")}
              </span>
              {g.label} <span className="font-mono text-basalt-400">({(g.utilisation * 100).toFixed(0)} % of limit)</span>
              {g.justification ? <span className="block text-2xs text-ochre-700">accepted with justification: {g.justification}</span> : null}
            </span>
          );
        },
      }),
      col.accessor("updatedAt", { header: "Last change", cell: (c) => <span className="text-basalt-500">{c.getValue()}</span> }),
    ],
    [projectId, showComments],
  );
  // TanStack Table returns functions the React Compiler cannot memoise; this component is
  // simply left uncompiled, which is what the rule reports.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data: rows,
    columns,
    state: { sorting, globalFilter: filter },
    onSortingChange: setSorting,
    onGlobalFilterChange: setFilter,
    globalFilterFn: (row, _id, value: string) => {
      const r = row.original;
      const hay = [r.tag, r.machineTrain, r.location, r.status, r.latestRevision, r.latestApproved, ...r.flags, r.governing?.label ?? ""].join(" ").toLowerCase();
      return hay.includes(String(value).toLowerCase());
    },
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });
  return (
    <div className="space-y-2">
      <input className="field-input max-w-xs" placeholder="Filter by tag, train, status, check…" aria-label="Filter foundations" value={filter} onChange={(e) => setFilter(e.target.value)} />
      <div className="slab overflow-x-auto" tabIndex={0} role="region" aria-label="Foundations, scrollable">
        <table data-testid="foundation-table">
          <thead>
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h) => {
                  const dir = h.column.getIsSorted();
                  return (
                    <th key={h.id} aria-sort={dir === "asc" ? "ascending" : dir === "desc" ? "descending" : "none"}>
                      <button type="button" className="tracking-wide" onClick={h.column.getToggleSortingHandler()}>
                        {flexRender(h.column.columnDef.header, h.getContext())} {dir === "asc" ? "▲" : dir === "desc" ? "▼" : ""}
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((r) => (
              <tr key={r.id}>
                {r.getVisibleCells().map((c) => (
                  <td key={c.id}>{flexRender(c.column.columnDef.cell, c.getContext())}</td>
                ))}
              </tr>
            ))}
            {table.getRowModel().rows.length === 0 ? (
              <tr>
                <td colSpan={columns.length} className="text-center text-sm text-basalt-400">
                  No foundation matches “{filter}”.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}
