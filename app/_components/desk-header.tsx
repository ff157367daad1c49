"use client";

import Link from "next/link";
import { usePathname, useRouter } from "next/navigation";
import { useActionState } from "react";
import { roleHomePath, roleLabels, type ProjectRole } from "@/modules/platform/permissions";
import { signOutAction } from "../(auth)/actions";
import { BrandMark } from "./brand";
import { confirmLeave } from "./workspace/use-leave-guard";
import type { FormState } from "./form-kit";

interface HeaderProject {
  id: string;
  code: string;
  name: string;
  role: ProjectRole;
}

function navFor(projectId: string, role: ProjectRole): { href: string; label: string }[] {
  const base = `/projects/${projectId}`;
  if (role === "vendor") return [{ href: `${base}/requests`, label: "Data requests" }];
  const items = [{ href: base, label: "Foundations" }];
  if (role === "manager" || role === "designer") items.push({ href: `${base}/requests`, label: "Data requests" });
  if (role !== "viewer") items.push({ href: `${base}/members`, label: "Team" });
  if (role === "manager") items.push({ href: `${base}/settings`, label: "Settings" });
  return items;
}

export function DeskHeader({ user, projects }: { user: { name: string; email: string; isAdmin: boolean }; projects: HeaderProject[] }) {
  const pathname = usePathname();
  const router = useRouter();
  const [, signOut] = useActionState(signOutAction as unknown as (s: FormState, f: FormData) => Promise<FormState>, null);
  const currentId = /^\/projects\/([0-9a-f-]{36})/.exec(pathname)?.[1];
  const current = projects.find((p) => p.id === currentId);
  return (
    <header className="border-b border-basalt-800 bg-basalt-900 text-grout-100">
      <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-2 px-6 py-3">
        <Link href="/" className="flex items-center gap-2 text-white no-underline">
          <BrandMark className="h-7 w-7 text-ochre-300" />
          <span className="font-semibold tracking-tight">Plinthwise</span>
        </Link>
        <label className="flex items-center gap-2 text-xs text-grout-300">
          <span className="sr-only sm:not-sr-only">Project</span>
          <select
            aria-label="Switch project"
            className="rounded-plinth border border-basalt-600 bg-basalt-800 px-2 py-1 text-sm text-white"
            value={current?.id ?? ""}
            onChange={(e) => {
              // The workspace asks first when it holds unsaved changes (use-leave-guard).
              if (!confirmLeave()) {
                e.target.value = current?.id ?? "";
                return;
              }
              const next = projects.find((p) => p.id === e.target.value);
              router.push(next ? roleHomePath(next.id, next.role) : "/");
            }}
          >
            <option value="">All projects</option>
            {projects.map((p) => (
              <option key={p.id} value={p.id}>
                {p.code} · {p.name}
              </option>
            ))}
          </select>
        </label>
        {current ? (
          <nav aria-label="Project" className="flex gap-1">
            {navFor(current.id, current.role).map((item) => {
              const active = pathname === item.href;
              return (
                <Link
                  key={item.href}
                  href={item.href}
                  aria-current={active ? "page" : undefined}
                  className={`rounded-plinth px-2.5 py-1 text-sm no-underline ${active ? "bg-basalt-700 text-white" : "text-grout-200 hover:bg-basalt-800"}`}
                >
                  {item.label}
                </Link>
              );
            })}
          </nav>
        ) : null}
        <div className="ml-auto flex items-center gap-4">
          {user.isAdmin ? (
            <Link href="/admin/outbox" className="text-sm text-grout-200 no-underline hover:text-white">
              Outbox
            </Link>
          ) : null}
          <div className="text-right leading-tight" data-testid="whoami">
            <div className="text-sm font-medium text-white">{user.name}</div>
            <div className="text-2xs uppercase tracking-wider text-ochre-300">
              {current ? `${roleLabels[current.role]} · ${current.code}` : user.isAdmin ? "Administrator" : "No project open"}
            </div>
          </div>
          <form action={signOut}>
            <button type="submit" className="rounded-plinth border border-basalt-600 px-2.5 py-1 text-xs text-grout-100 hover:bg-basalt-800">
              Sign out
            </button>
          </form>
        </div>
      </div>
    </header>
  );
}
