import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { roleHomePath, roleLabels } from "@/modules/platform/permissions";
import { listProjectsForUser } from "@/db/queries/projects";
import { actorOf, getPageUser } from "../_lib/page-guard";
import { EmptyState } from "../_components/brand";

export const metadata: Metadata = { title: "Your desk" };

export default async function HomePage() {
  const user = await getPageUser();
  const projects = await listProjectsForUser(actorOf(user));
  // One project: go straight to the role's home in it.
  const only = projects[0];
  if (projects.length === 1 && only && !user.isAdmin) redirect(roleHomePath(only.id, only.role));
  return (
    <div className="space-y-6">
      <div className="flex items-end justify-between gap-4">
        <div>
          <h1>Your desk</h1>
          <p className="mt-1 text-sm text-basalt-500">Projects you are a member of, and your role on each.</p>
        </div>
        {user.isAdmin || user.mayCreateProjects ? (
          <Link href="/projects/new" className="btn-primary">
            New project
          </Link>
        ) : null}
      </div>
      {projects.length === 0 ? (
        <EmptyState title="No projects yet">
          When a project manager invites you, the project appears here.
        </EmptyState>
      ) : (
        <div className="slab overflow-hidden">
          <table>
            <thead>
              <tr>
                <th>Code</th>
                <th>Project</th>
                <th>Your role</th>
              </tr>
            </thead>
            <tbody>
              {projects.map((p) => (
                <tr key={p.id}>
                  <td className="font-mono">{p.code}</td>
                  <td>
                    <Link href={roleHomePath(p.id, p.role)}>{p.name}</Link>
                  </td>
                  <td>{roleLabels[p.role]}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {user.isAdmin ? (
        <p className="text-sm">
          Administration: <Link href="/admin/outbox">mail outbox</Link>
        </p>
      ) : null}
    </div>
  );
}
