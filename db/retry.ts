/**
 * PostgreSQL's answers that mean "nothing was done, run the transaction again": deadlock_detected (40P01),
 * serialization_failure (40001). A push can meet one when two transactions take per-(pilot, week) advisory locks
 * (migration "season-week-turnarounds-triggers") for two weeks in opposite orders across statements: PostgreSQL
 * aborts one of them whole, so running it again is safe and the phone gets its acks instead of a 500.
 */
const RETRYABLE = new Set(["40P01", "40001"]);

/** The SQLSTATE of a driver error, or of the error a query builder wrapped it in (`cause`). */
export function sqlState(error: unknown): string | undefined {
  for (let e: unknown = error, depth = 0; e && typeof e === "object" && depth < 4; e = (e as { cause?: unknown }).cause, depth++) {
    const code = (e as { code?: unknown }).code;
    if (typeof code === "string") return code;
  }
  return undefined;
}

/** Runs `attempt` (one whole transaction) again, up to `tries` times in all, while PostgreSQL aborts it as above. */
export async function retryAborted<T>(attempt: () => Promise<T>, tries = 3): Promise<T> {
  for (let n = 1; ; n++) {
    try {
      return await attempt();
    } catch (error) {
      if (n >= tries || !RETRYABLE.has(sqlState(error) ?? "")) throw error;
    }
  }
}
