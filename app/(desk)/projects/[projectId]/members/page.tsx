import type { Metadata } from "next";
import { roleAllows, roleLabels } from "@/modules/platform/permissions";
import { listMembers } from "@/db/queries/projects";
import { requireProjectPage } from "../../../../_lib/page-guard";
import { InviteForm, RemoveMemberButton } from "./member-forms";

export const metadata: Metadata = { title: "Team" };

export default async function MembersPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const { actor, project, role, user } = await requireProjectPage(projectId, "members.read");
  const members = await listMembers(actor, projectId);
  const manage = roleAllows(role, "members.manage");
  return (
    <div className="space-y-6">
      <div>
        <p className="font-mono text-xs text-basalt-400">{project.code}</p>
        <h1>Project team</h1>
      </div>
      <div className="slab overflow-hidden">
        <table data-testid="member-table">
          <thead>
            <tr>
              <th>Name</th>
              <th>E-mail</th>
              <th>Role</th>
              <th>Company</th>
              <th>Status</th>
              {manage ? <th className="w-24" /> : null}
            </tr>
          </thead>
          <tbody>
            {members.map((m) => (
              <tr key={m.memberId}>
                <td>{m.name}</td>
                <td className="font-mono text-xs">{m.email}</td>
                <td>{roleLabels[m.role]}</td>
                <td>{m.company ?? "—"}</td>
                <td>{m.hasPassword ? <span className="tag bg-moss-100 text-moss-700">active</span> : <span className="tag bg-ochre-100 text-ochre-700">invited</span>}</td>
                {manage ? <td>{m.userId !== user.id ? <RemoveMemberButton projectId={projectId} memberId={m.memberId} name={m.name} /> : null}</td> : null}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {manage ? (
        <section className="slab max-w-3xl p-5">
          <h3>Invite someone</h3>
          <p className="mt-1 text-sm text-basalt-500">They receive a one-time link, valid for seven days, that sets their password.</p>
          <InviteForm projectId={projectId} />
        </section>
      ) : null}
    </div>
  );
}
