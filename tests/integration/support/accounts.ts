import { randomUUID } from "node:crypto";
import { db } from "@/db";
import { users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";

/** A fresh account (unique e-mail) with this password; returns its e-mail. */
export async function makeAccount(tag: string, password: string, passwordHash?: string): Promise<string> {
  const email = `${tag}-${randomUUID().slice(0, 8)}@example.com`;
  await db.insert(users).values({ email, name: `Test ${tag}`, passwordHash: passwordHash ?? (await hashPassword(password)) });
  return email;
}

/** A random private address, so counts left by earlier runs in the same database never meet it. */
export function freshAddress(): string {
  const b = randomUUID().replace(/-/g, "");
  return `10.${parseInt(b.slice(0, 2), 16)}.${parseInt(b.slice(2, 4), 16)}.${parseInt(b.slice(4, 6), 16)}`;
}

/** Runs `fn` with TRUST_PROXY set to `hops` (unset when null), restoring it after. */
export async function withTrustProxy<T>(hops: string | null, fn: () => Promise<T>): Promise<T> {
  const before = process.env.TRUST_PROXY;
  if (hops === null) delete process.env.TRUST_PROXY;
  else process.env.TRUST_PROXY = hops;
  try {
    return await fn();
  } finally {
    if (before === undefined) delete process.env.TRUST_PROXY;
    else process.env.TRUST_PROXY = before;
  }
}
