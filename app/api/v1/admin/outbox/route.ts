import { listCapturedEmails, listOutgoingEmails } from "@/db/queries/mail";
import { defineRoute } from "../../../../_lib/route";

export const dynamic = "force-dynamic";

export const GET = defineRoute({
  access: { kind: "admin" },
  handler: async () => ({ outgoing: await listOutgoingEmails(100), received: await listCapturedEmails(100) }),
});
