import type { Database } from "@/db";
import { applyPush } from "@/db/queries/sync-push";
import { pushRequestSchema } from "@/lib/validations/sync";
import type { PushFaults, SimUser } from "./sync-sim-network";

class Crash extends Error {}

/**
 * Server-side faults of a push that the network cannot fake (used by the sync simulation):
 * - crash: the push does all its work in its transaction and the server dies before the
 *   commit (a restart mid-push): nothing of it is kept, the device gets no reply;
 * - commitLate: the push runs in a transaction that commits `ms` later, while other devices
 *   push and pull (writers committing out of order; pulls must wait for it, not skip it).
 * Both call the same query function the route handler calls, after the same body schema.
 */
export function pushFaults(db: Database): PushFaults {
  const read = (init: RequestInit | undefined) => pushRequestSchema.parse(JSON.parse(String(init?.body)));
  return {
    async crash(user: SimUser, init: RequestInit | undefined) {
      const body = read(init);
      await db
        .transaction(async (tx) => {
          await applyPush(tx as unknown as Database, user.id, body); // a savepoint inside the doomed transaction
          throw new Crash();
        })
        .catch((e: unknown) => {
          if (!(e instanceof Crash)) throw e;
        });
    },
    async commitLate(user: SimUser, init: RequestInit | undefined, ms: number) {
      const body = read(init);
      await db.transaction(async (tx) => {
        await applyPush(tx as unknown as Database, user.id, body);
        await new Promise((r) => setTimeout(r, ms));
      });
    },
  };
}
