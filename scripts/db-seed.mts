// Seeds the invented demo scenario (idempotent): one account per role, the
// pump-house project and its two foundations.
import { closeDb } from "../db/client";
import { seedDemo } from "../db/seed";

const result = await seedDemo();
await closeDb();
console.log(result.created ? "[seed] demo data created" : "[seed] demo data already present");
