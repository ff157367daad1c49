import { runMigrations } from "../db/migrate";
import { closeDb } from "../db/client";

await runMigrations();
await closeDb();
console.log("[db] migrations applied");
