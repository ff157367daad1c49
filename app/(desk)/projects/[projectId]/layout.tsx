import type { ReactNode } from "react";
import { notFound } from "next/navigation";
import { actorOf, getMemberProject, getPageUser } from "../../../_lib/page-guard";

// Any page under a project needs membership first; each page then checks its own permission.
export default async function ProjectLayout({ children, params }: { children: ReactNode; params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const user = await getPageUser();
  if (!(await getMemberProject(actorOf(user), projectId))) notFound();
  return <>{children}</>;
}
