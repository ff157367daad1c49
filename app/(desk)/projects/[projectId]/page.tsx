import type { Metadata } from "next";
import Link from "next/link";
import { roleAllows } from "@/modules/platform/permissions";
import { listFoundations } from "@/db/queries/projects";
import { requireProjectPage } from "../../../_lib/page-guard";
import { EmptyState } from "../../../_components/brand";
import { NewFoundationForm } from "./new-foundation-form";

export const metadata: Metadata = { title: "Foundations" };

export default async function ProjectPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const { actor, project, role } = await requireProjectPage(projectId, "project.read");
  const foundations = await listFoundations(actor, projectId);
  return (
    <div className="space-y-6">
      <div>
        <p className="font-mono text-xs text-basalt-400">{project.code}</p>
        <h1>{project.name}</h1>
        <p className="mt-1 text-sm text-basalt-500">
          {[project.client && `Client: ${project.client}`, project.site && `Site: ${project.site}`, `Units: ${project.units === "si" ? "SI" : "US customary"}`]
            .filter(Boolean)
            .join(" · ")}
        </p>
      </div>
      <section className="space-y-3">
        <h2>Foundations</h2>
        {foundations.length === 0 ? (
          <EmptyState title="No foundations on this project yet">
            {roleAllows(role, "foundation.create") ? "Add the first one below." : "A designer adds them."}
          </EmptyState>
        ) : (
          <div className="slab overflow-hidden">
            <table data-testid="foundation-table">
              <thead>
                <tr>
                  <th>Tag</th>
                  <th>Machine train</th>
                  <th>Location</th>
                  <th>Last change</th>
                </tr>
              </thead>
              <tbody>
                {foundations.map((f) => (
                  <tr key={f.id}>
                    <td className="font-mono font-medium">
                      <Link href={`/projects/${projectId}/foundations/${f.id}`}>{f.tag}</Link>
                    </td>
                    <td>{f.machineTrain}</td>
                    <td>{f.location}</td>
                    <td className="text-basalt-500">{f.updatedAt.toISOString().slice(0, 10)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
      {roleAllows(role, "foundation.create") ? (
        <section className="slab max-w-2xl p-5">
          <h3>Add a foundation</h3>
          <NewFoundationForm projectId={projectId} />
        </section>
      ) : null}
    </div>
  );
}
