import { sql } from "drizzle-orm";
import fc from "fast-check";
import type { PoolClient } from "pg";
import { v7 as uuidv7 } from "uuid";
import { afterAll, describe, expect, it } from "vitest";
import { listChanges } from "@/db/queries/sync-pull";
import { db, getPool } from "./support/db";
import { createSimUsers } from "./sync-sim";

afterAll(async () => {
  await getPool().end();
});

/**
 * Pulls against writers that do not take turns (SYNC.md §3): several connections open
 * transactions, insert events and re-stamp the run (as a derivation does), hold them open and
 * commit or roll back in a random order, while a device pulls page by page. Every committed
 * event is pulled exactly once, nothing rolled back is ever pulled.
 */
type Op = { writer: number; act: "insert" | "touch" | "commit" | "rollback" | "pull"; n: number };

const opArb: fc.Arbitrary<Op> = fc.record({
  writer: fc.nat({ max: 3 }),
  act: fc.constantFrom("insert", "insert", "insert", "touch", "commit", "commit", "rollback", "pull", "pull"),
  n: fc.integer({ min: 1, max: 4 }),
});

const WRITERS = 4;
const RUNS = Number(process.env.SYNC_CONCURRENT_RUNS ?? 40);
const SEED = Number(process.env.SYNC_CONCURRENT_SEED ?? 20261203);

describe("pulls while writers commit out of order (property)", () => {
  it(`never miss and never repeat an event, over ${RUNS} seeded interleavings of ${WRITERS} writers (seed ${SEED})`, async () => {
    const [user] = await createSimUsers(db, 1);
    const clients: PoolClient[] = [];
    for (let i = 0; i < WRITERS; i++) clients.push(await getPool().connect());
    try {
      await fc.assert(
        fc.asyncProperty(fc.array(opArb, { minLength: 5, maxLength: 40 }), async (ops) => {
          const sessionId = uuidv7();
          const runId = uuidv7();
          const device = `concurrent-${uuidv7()}`;
          await db.execute(sql`insert into field_sessions (id, owner_id, field_name, started_at) values (${sessionId}, ${user!.id}, 'Race field', now())`);
          await db.execute(sql`insert into runs (id, session_id, created_by, task, task_code, edition, created_at)
            values (${runId}, ${sessionId}, ${user!.id}, '{}', 'H', 'x', now())`);
          let seq = 0;
          const open = new Map<number, string[]>(); // writer → event ids in its open transaction
          const committed = new Set<string>();
          const rolledBack = new Set<string>();
          const pulled: string[] = [];
          let cursor = "0";
          let toucher: number | null = null;
          const pullPage = async (limit: number) => {
            const page = await listChanges(db, { userId: user!.id, cursor, limit });
            for (const i of page.items) if (i.type === "event" && i.data.runId === runId) pulled.push(i.data.id);
            cursor = page.nextCursor;
            return page.hasMore;
          };
          while (await pullPage(50)); // the device has the run before the writers start
          try {
            for (const op of ops) {
              const c = clients[op.writer % WRITERS]!;
              let mine = open.get(op.writer);
              if ((op.act === "insert" || op.act === "touch") && !mine) {
                await c.query("begin"); // a writer's first write opens its transaction
                open.set(op.writer, (mine = []));
              }
              if (op.act === "touch" && (toucher === null || toucher === op.writer)) {
                toucher = op.writer; // the run's row lock is held until this writer ends (another would wait forever here)
                await c.query("update runs set server_seq = nextval('sync_seq'), xid = pg_current_xact_id() where id = $1", [runId]);
              } else if (op.act === "insert" && mine) {
                for (let k = 0; k < op.n; k++) {
                  const id = uuidv7();
                  await c.query(
                    `insert into events (id, run_id, device_id, seq, recorded_by, kind, body, wall_ms, mono_ms, page_id, corrected_ms)
                     values ($1, $2, $3, $4, $5, 'launch', '{"kind":"launch","lane":0}', 0, 0, 'p', 0)`,
                    [id, runId, device, ++seq, user!.id],
                  );
                  mine.push(id);
                }
              } else if ((op.act === "commit" || op.act === "rollback") && mine) {
                await c.query(op.act);
                for (const id of mine) (op.act === "commit" ? committed : rolledBack).add(id);
                open.delete(op.writer);
                if (toucher === op.writer) toucher = null;
              } else if (op.act === "pull") {
                await pullPage(op.n * 2); // small pages: cursors land between the rows of one transaction
              }
            }
            for (const [w, ids] of open) {
              await clients[w % WRITERS]!.query("commit");
              for (const id of ids) committed.add(id);
            }
            open.clear();
          } finally {
            for (const w of open.keys()) await clients[w % WRITERS]!.query("rollback");
          }
          while (await pullPage(3));
          expect(pulled.length).toBe(new Set(pulled).size); // never repeated
          expect(new Set(pulled)).toEqual(committed); // never missed, nothing rolled back
          for (const id of rolledBack) expect(pulled).not.toContain(id);
        }),
        { numRuns: RUNS, seed: SEED, endOnFailure: true },
      );
    } finally {
      for (const c of clients) {
        await c.query("rollback").catch(() => undefined);
        c.release();
      }
    }
  }, 300_000);
});
