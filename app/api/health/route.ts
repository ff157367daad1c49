import { sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { defineRoute } from "../../_lib/route";

export const dynamic = "force-dynamic";

// Liveness and database reachability, for load balancers and the start script.
export const GET = defineRoute({
  access: { kind: "public" },
  handler: async () => {
    try {
      await getDb().execute(sql`select 1`);
      return { ok: true, database: "up" };
    } catch {
      return Response.json({ ok: false, database: "down" }, { status: 503 });
    }
  },
});
