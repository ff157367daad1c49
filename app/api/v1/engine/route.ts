import { ENGINE_VERSION } from "@/modules/calc";
import { defineRoute } from "@/app/_lib/route";

export const dynamic = "force-dynamic";

// The server's engine and contract version: the workspace computes in the browser only while its
// own bundled engine is this one (use-calculation.ts), and otherwise shows the server's numbers.
export const GET = defineRoute({
  access: { kind: "signedIn" },
  handler: async () => ({ engineVersion: ENGINE_VERSION, schemaVersion: 1 }),
});
