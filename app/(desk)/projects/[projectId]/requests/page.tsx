import type { Metadata } from "next";
import { requireProjectPage } from "../../../../_lib/page-guard";
import { EmptyState } from "../../../../_components/brand";

export const metadata: Metadata = { title: "Data requests" };

export default async function RequestsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const { project, role } = await requireProjectPage(projectId, "vendorRequest.readOwn");
  return (
    <div className="space-y-6">
      <div>
        <p className="font-mono text-xs text-basalt-400">{project.code}</p>
        <h1>Machine data requests</h1>
        <p className="mt-1 text-sm text-basalt-500">
          {role === "vendor"
            ? "Requests for machine data addressed to your company. Each one lists the machines and the figures the foundation designer needs."
            : "Requests sent to machine vendors on this project."}
        </p>
      </div>
      <EmptyState title="No open data requests">
        {role === "vendor" ? "When a designer asks your company for machine data, the request appears here and you are e-mailed." : "Send one from a foundation's machine section."}
      </EmptyState>
    </div>
  );
}
