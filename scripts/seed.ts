// Seeds the invented demo club (idempotent). Run with --conditions=react-server (db modules are server-only).
import { db, getPool } from "@/db";
import { seedDemo } from "@/db/seed";

try {
  const outcome = await seedDemo(db);
  console.log(outcome === "seeded" ? "[windowcall] demo club seeded" : "[windowcall] demo club already present");
} finally {
  await getPool().end();
}
