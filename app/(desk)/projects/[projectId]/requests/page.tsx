import type { Metadata } from "next";
import Link from "next/link";
import { roleAllows } from "@/modules/platform/permissions";
import { listFoundationsWithDrafts } from "@/db/queries/drafts";
import { listVendorContacts, listVendorRequests, requestStatusLabels } from "@/db/queries/vendor-requests";
import { requireProjectPage } from "../../../../_lib/page-guard";
import { EmptyState } from "../../../../_components/brand";
import { SendRequestForm } from "../../../../_components/vendor/send-request-form";
import { sendDataRequestAction } from "./actions";

export const metadata: Metadata = { title: "Data requests" };

export default async function RequestsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const { project, role, actor } = await requireProjectPage(projectId, "vendorRequest.readOwn");
  // Scoped in the query: a vendor gets only their company's requests.
  const requests = await listVendorRequests(actor, projectId);
  const maySend = roleAllows(role, "vendorRequest.create");
  const foundations = maySend ? await listFoundationsWithDrafts(actor, projectId) : [];
  const contacts = maySend ? await listVendorContacts(actor, projectId) : [];
  return (
    <div className="space-y-6">
      <div>
        <p className="font-mono text-xs text-basalt-400">{project.code}</p>
        <h1>Machine data requests</h1>
        <p className="mt-1 text-sm text-basalt-500">
          {role === "vendor"
            ? "Requests for machine data addressed to your company. Each one lists the machines and the figures the foundation designer needs."
            : "Requests sent to machine vendors on this project, with the latest version each vendor submitted."}
        </p>
      </div>
      {requests.length === 0 ? (
        <EmptyState title="No open data requests">
          {role === "vendor" ? "When a designer asks your company for machine data, the request appears here and you are e-mailed." : "Send one below."}
        </EmptyState>
      ) : (
        <table className="slab" data-testid="request-list">
          <thead>
            <tr>
              <th>Foundation</th>
              <th>Machines</th>
              <th>Vendor</th>
              <th>Wanted by</th>
              <th>Latest version</th>
              <th>Status</th>
            </tr>
          </thead>
          <tbody>
            {requests.map((r) => (
              <tr key={r.id}>
                <td>
                  <Link href={`/projects/${projectId}/requests/${r.id}`}>{r.foundationTag}</Link>
                  <div className="text-xs text-basalt-500">{r.machineTrain}</div>
                </td>
                <td>{r.machineNames.join("; ")}</td>
                <td>
                  {r.companyName}
                  <div className="text-xs text-basalt-500">{r.contactName}</div>
                </td>
                <td className="font-mono">{r.dueOn ?? "—"}</td>
                <td className="font-mono">{r.latestVersion ?? "—"}</td>
                <td>{requestStatusLabels[r.status]}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {maySend ? (
        <section className="slab space-y-3 p-5">
          <h2>Ask a vendor for machine data</h2>
          <SendRequestForm
            projectId={projectId}
            foundations={foundations.map((f) => ({ id: f.id, tag: f.tag, machineNames: f.machineNames }))}
            contacts={contacts.map((c) => ({ userId: c.userId, label: `${c.name} (${c.companyName})` }))}
            mayInvite={roleAllows(role, "members.manage")}
            teamHref={`/projects/${projectId}/members`}
            action={sendDataRequestAction}
          />
        </section>
      ) : null}
    </div>
  );
}
