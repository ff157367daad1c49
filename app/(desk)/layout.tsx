import type { ReactNode } from "react";
import { listProjectsForUser } from "@/db/queries/projects";
import { actorOf, getPageUser } from "../_lib/page-guard";
import { DeskHeader } from "../_components/desk-header";

export const dynamic = "force-dynamic";

export default async function DeskLayout({ children }: { children: ReactNode }) {
  const user = await getPageUser();
  const projects = await listProjectsForUser(actorOf(user));
  return (
    <div className="min-h-screen">
      <DeskHeader user={{ name: user.name, email: user.email, isAdmin: user.isAdmin }} projects={projects} />
      <main className="mx-auto max-w-7xl px-6 py-8">{children}</main>
    </div>
  );
}
