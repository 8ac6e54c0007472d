import "server-only";
import type { SQL } from "drizzle-orm";
import { NodePgSession, NodePgTransaction } from "drizzle-orm/node-postgres";
import type { PgDialect } from "drizzle-orm/pg-core";
import type { Pool, PoolClient, QueryResult } from "pg";
import type { Database } from "../index";
import type { Tx } from "./sync-db";

/**
 * A transaction whose statements can also go to PostgreSQL several at a time: `send` writes a list of
 * statements as ONE simple-protocol message (one round trip), `begin` in front when the transaction has not
 * begun and `commit` behind when asked. In READ COMMITTED each statement of such a message still takes its own
 * snapshot when it starts, after the statements before it finished (exec_simple_query), so a read sent after a
 * lock in the same message sees everything committed before the lock was granted, as when they are sent one
 * by one. If a statement fails, PostgreSQL runs none after it (the transaction is then rolled back here).
 * `tx` is an ordinary Drizzle transaction on the same connection for everything else (it begins the
 * transaction itself when it comes first).
 *
 * Parameters go into the text as literals: each value converted to text as node-postgres converts a
 * parameter (pg/lib/utils.js prepareValue: arrays to array literals, dates, objects as JSON), then quoted as an untyped
 * literal, which PostgreSQL types from its context as it types an unspecified parameter. A string holding a
 * NUL (which a message cannot carry; the push's schemas refuse them) is refused before anything is sent.
 */
export type Pipeline = {
  tx: Tx;
  /** Sends these statements in one message; returns each statement's result (begin and commit left out). */
  send: (statements: readonly SQL[], opts?: { commit?: boolean }) => Promise<QueryResult[]>;
};

type DbInternals = { dialect: PgDialect; _: { fullSchema: Record<string, unknown>; schema: unknown; tableNamesMap: Record<string, string> }; $client: Pool };

export async function pipelineTransaction<T>(db: Database, work: (p: Pipeline) => Promise<T>): Promise<T> {
  const inner = db as unknown as DbInternals;
  const client: PoolClient = await inner.$client.connect();
  const t: { state: "idle" | "open" | "done" } = { state: "idle" };
  const begin = async () => {
    if (t.state !== "idle") return;
    t.state = "open";
    await client.query("begin");
  };
  // Drizzle's statements go through this: the transaction begins before the first of them
  const wrapped = {
    query: async (...args: unknown[]) => {
      await begin();
      return (client.query as (...a: unknown[]) => Promise<unknown>)(...args);
    },
  };
  const schema = { fullSchema: inner._.fullSchema, schema: inner._.schema, tableNamesMap: inner._.tableNamesMap };
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  const session = new NodePgSession(wrapped as any, inner.dialect, schema as any);
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  const tx = new NodePgTransaction(inner.dialect, session, schema as any) as unknown as Tx;
  const send: Pipeline["send"] = async (statements, opts = {}) => {
    if (t.state === "done") throw new Error("the transaction has ended");
    const texts = statements.map((s) => inlineParams(inner.dialect.sqlToQuery(s)));
    const lead = t.state === "idle" ? 1 : 0;
    if (lead) texts.unshift("begin");
    if (opts.commit) texts.push("commit");
    t.state = "open";
    const res = (await client.query(texts.join(";\n"))) as unknown as QueryResult | QueryResult[];
    if (opts.commit) t.state = "done";
    const all = Array.isArray(res) ? res : [res];
    return all.slice(lead, opts.commit ? all.length - 1 : all.length);
  };
  try {
    const out = await work({ tx, send });
    if (t.state === "open") {
      await client.query("commit");
      t.state = "done";
    }
    client.release();
    return out;
  } catch (error) {
    let broken: Error | undefined;
    if (t.state === "open") {
      try {
        await client.query("rollback");
      } catch (e) {
        broken = e as Error; // the connection is not fit for the pool any more
      }
    }
    client.release(broken);
    throw error;
  }
}

/** `{ sql, params }` with each `$n` outside quotes replaced by its value as a literal (above). */
export function inlineParams(q: { sql: string; params: unknown[] }): string {
  const { sql: text, params } = q;
  let out = "";
  let i = 0;
  while (i < text.length) {
    const c = text[i]!;
    if (c === "'" || c === '"') {
      // a quoted string or identifier: copied as is (a doubled quote stays inside it)
      let j = i + 1;
      for (; j < text.length; j++) {
        if (text[j] === c) {
          if (text[j + 1] === c) j++;
          else break;
        }
      }
      out += text.slice(i, j + 1);
      i = j + 1;
      continue;
    }
    if (c === "$" && /[0-9]/.test(text[i + 1] ?? "") && !/[A-Za-z0-9_]/.test(text[i - 1] ?? "")) {
      let j = i + 1;
      while (j < text.length && /[0-9]/.test(text[j]!)) j++;
      const n = Number(text.slice(i + 1, j));
      if (n < 1 || n > params.length) throw new Error(`no parameter $${n}`);
      out += literal(params[n - 1]);
      i = j;
      continue;
    }
    out += c;
    i++;
  }
  return out;
}

/** A value as an untyped SQL literal, its text as node-postgres would send it as a parameter. */
export function literal(value: unknown): string {
  const s = paramText(value);
  if (s === null) return "NULL";
  if (s.includes("\0")) throw new Error("a value holds a NUL character, which PostgreSQL's text cannot hold");
  const quoted = `'${s.replaceAll("'", "''")}'`;
  // E'' only when needed: there a backslash escapes, so it is doubled
  return s.includes("\\") ? `E${quoted.replaceAll("\\", "\\\\")}` : quoted;
}

/** pg/lib/utils.js prepareValue for the values statements here carry (no Buffers: binary parameters stay parameters). */
function paramText(v: unknown): string | null {
  if (v === null || v === undefined) return null;
  if (Buffer.isBuffer(v)) throw new Error("a binary parameter cannot go into a pipelined statement");
  if (v instanceof Date) return v.toISOString();
  if (Array.isArray(v)) return arrayText(v);
  if (typeof v === "object") return JSON.stringify(v);
  return String(v);
}

/** An array literal as pg/lib/utils.js arrayString writes it: every element quoted, NULL bare, nested arrays inline. */
function arrayText(list: readonly unknown[]): string {
  const parts = list.map((x) => {
    if (Array.isArray(x)) return arrayText(x);
    const t = paramText(x);
    return t === null ? "NULL" : `"${t.replaceAll("\\", "\\\\").replaceAll('"', '\\"')}"`;
  });
  return `{${parts.join(",")}}`;
}
