import { sql } from "drizzle-orm";
import { db, getPool } from "@/db";
import { seedBenchSeason } from "./season-seed";
const existing = process.env.PILOT;
const pilotId = existing ?? (await seedBenchSeason({ runs: 5000, flights: 6, password: "season-bench-thermals" })).pilotId;
console.log("pilot", pilotId);
await getPool().end();
