import { integer, json, pgTable, uuid } from "drizzle-orm/pg-core";
import { runs } from "./sessions";

/**
 * A run's folded state (lib/results/fold-state.ts): what the next push needs to derive the run
 * from its new events only, instead of reading and folding all of them again. Written with every
 * stored derivation of a push or a re-derivation (db/queries/runs.ts storeDerivations); a state of
 * another `version` (FOLD_VERSION: the fold's code changed) is never read, so the next push derives
 * the run in full and writes a new one. No row: the run is derived in full (a clock step, or never pushed since).
 */
export const runFolds = pgTable("run_folds", {
  runId: uuid("run_id").primaryKey().references(() => runs.id, { onDelete: "cascade" }),
  version: integer("version").notNull(),
  state: json("state").notNull(),
});
