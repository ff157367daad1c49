import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { getPageUser } from "../../../_lib/page-guard";
import { NewProjectForm } from "./new-project-form";

export const metadata: Metadata = { title: "New project" };

export default async function NewProjectPage() {
  const user = await getPageUser();
  if (!user.isAdmin && !user.mayCreateProjects) notFound();
  return (
    <div className="max-w-2xl space-y-6">
      <h1>Set up a project</h1>
      <div className="slab p-5">
        <NewProjectForm />
      </div>
    </div>
  );
}
