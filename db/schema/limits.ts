import { bigint, integer, pgTable, text } from "drizzle-orm/pg-core";

/**
 * Attempt counters of rate-limiter-flexible's RateLimiterPostgres (db/limits.ts), one row per key
 * (`<limiter>:<key>`). The columns are the ones the library reads and writes; `key` is text rather than
 * its default varchar(255) because a key may hold a 254-character e-mail and an address. Made by a
 * migration so a fresh database works before the first request (the limiters do not create it).
 */
export const rateLimits = pgTable("rate_limits", {
  key: text("key").primaryKey(),
  points: integer("points").notNull().default(0),
  expire: bigint("expire", { mode: "number" }), // ms since the epoch; null = never
});
