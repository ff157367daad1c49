import type { Metadata } from "next";
import { listOutboxForAdmin } from "@/db/queries/mail";
import { isDemoMode } from "@/modules/platform/env";
import { requireAdminPage } from "../../../_lib/page-guard";
import { EmptyState } from "../../../_components/brand";

export const metadata: Metadata = { title: "Mail outbox" };

export default async function OutboxPage() {
  await requireAdminPage();
  const { outgoing, received } = await listOutboxForAdmin(50, isDemoMode());
  return (
    <div className="space-y-8">
      <div>
        <h1>Mail outbox</h1>
        <p className="mt-1 text-sm text-basalt-500">
          What the desk has sent, and, in the demo, what the local test mail server received (so links can be followed without a real mailbox).
        </p>
      </div>
      <section className="space-y-3">
        <h2>Sent by the desk</h2>
        {outgoing.length === 0 ? (
          <EmptyState title="Nothing sent yet" />
        ) : (
          <div className="slab overflow-hidden">
            <table data-testid="outgoing-table">
              <thead>
                <tr>
                  <th>When</th>
                  <th>To</th>
                  <th>Subject</th>
                  <th>State</th>
                  <th>Tries</th>
                </tr>
              </thead>
              <tbody>
                {outgoing.map((m) => (
                  <tr key={m.id}>
                    <td className="whitespace-nowrap font-mono text-xs">{m.createdAt.toISOString().replace("T", " ").slice(0, 19)}</td>
                    <td className="font-mono text-xs">{m.to}</td>
                    <td>{m.subject}</td>
                    <td>
                      <span className={`tag ${m.status === "sent" ? "bg-moss-100 text-moss-700" : m.status === "queued" || m.status === "sending" ? "bg-ochre-100 text-ochre-700" : "bg-brick-100 text-brick-700"}`}>
                        {m.status}
                      </span>
                      {m.lastError ? <p className="mt-1 text-2xs text-basalt-400">{m.lastError}</p> : null}
                    </td>
                    <td>{m.attempts}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
      <section className="space-y-3">
        <h2>Received by the local mail server</h2>
        {received.length === 0 ? (
          <EmptyState title="The local mail server has received nothing" />
        ) : (
          <ul className="space-y-3">
            {received.map((m) => (
              <li key={m.id} className="slab p-4" data-testid="captured-email">
                <p className="text-xs text-basalt-400">
                  {m.createdAt.toISOString().replace("T", " ").slice(0, 19)} · to {m.envelopeTo.join(", ")}
                </p>
                <p className="font-semibold">{m.subject}</p>
                <pre className="mt-2 whitespace-pre-wrap font-mono text-xs text-basalt-700">{m.text}</pre>
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
