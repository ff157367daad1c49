import { listOutboxForAdmin } from "@/db/queries/mail";
import { isDemoMode } from "@/modules/platform/env";
import { defineRoute } from "../../../../_lib/route";

export const dynamic = "force-dynamic";

export const GET = defineRoute({
  access: { kind: "admin" },
  handler: async () => listOutboxForAdmin(100, isDemoMode()),
});
