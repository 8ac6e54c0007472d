import { sql } from "drizzle-orm";
import { boolean, date, index, integer, pgEnum, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { users } from "./users";

/** Where a model stands: in use, in the workshop, put away, or gone to another pilot. */
export const modelStatusEnum = pgEnum("model_status", ["flying", "being-repaired", "retired", "sold"]);

/** A pilot's glider in the hangar (/hangar). Span and mass are as flown (ready to fly). */
export const models = pgTable(
  "models",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    ownerId: uuid("owner_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    spanMm: integer("span_mm").notNull(),
    massG: integer("mass_g").notNull(),
    /** Colour and marking, to tell it apart on the line. */
    marking: text("marking").notNull().default(""),
    notes: text("notes").notNull().default(""),
    status: modelStatusEnum("status").notNull().default("flying"),
    /** When it came to this owner (a transfer resets it; flights before it belong to the seller unless handed over). */
    ownedSince: timestamp("owned_since", { withTimezone: true }).notNull().defaultNow(),
    /** Sellers who handed the model over with its history: their lanes flown with it still count for it. */
    formerOwnerIds: uuid("former_owner_ids").array().notNull().default(sql`'{}'::uuid[]`),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("models_owner_id_idx").on(t.ownerId)],
);

/** One entry of a model's repair log: when, what was done, the mass after it. */
export const modelRepairs = pgTable(
  "model_repairs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    modelId: uuid("model_id").notNull().references(() => models.id, { onDelete: "cascade" }),
    repairedOn: date("repaired_on", { mode: "string" }).notNull(),
    work: text("work").notNull(),
    massAfterG: integer("mass_after_g"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("model_repairs_model_id_idx").on(t.modelId)],
);

/**
 * A seller's offer of a model to whoever holds an e-mail address, waiting for that account's
 * answer. The seller is never told whether the address has an account (every offer is answered
 * alike); the account with that address sees it in its hangar and accepts or declines; the seller
 * may withdraw it while it waits. On accept the model (and, if `withHistory`, its history) moves.
 */
export const modelOffers = pgTable(
  "model_offers",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    modelId: uuid("model_id").notNull().references(() => models.id, { onDelete: "cascade" }),
    sellerId: uuid("seller_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    /** lower-case */
    email: text("email").notNull(),
    withHistory: boolean("with_history").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    /** null while it waits */
    answer: text("answer", { enum: ["accepted", "declined", "withdrawn"] }),
    answeredAt: timestamp("answered_at", { withTimezone: true }),
  },
  (t) => [index("model_offers_model_id_idx").on(t.modelId), index("model_offers_email_idx").on(t.email)],
);
