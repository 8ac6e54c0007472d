import "./support/session";
import { eq, like } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { users } from "@/db/schema";
import { POST as signUpRoute } from "@/app/api/account/sign-up/route";
import { actAs } from "./support/session";
import { db, getPool } from "./support/db";
import { freshAddress, makeAccount, withTrustProxy } from "./support/accounts";
import { deviceId, push, pushRequest } from "./sync-fixtures";
import { POST as pushRoute } from "@/app/api/sync/push/route";

afterAll(async () => {
  await getPool().end();
});

describe("limits on sign-up and push (lib/auth/limits.ts)", () => {
  it("sign-up answers 429 with Retry-After after 30 accounts an hour from one address, creating nothing more", async () => {
    const from = freshAddress();
    const tag = `burst-${from.replace(/\./g, "-")}`;
    const signUp = (i: number) =>
      signUpRoute(new Request("http://test/api/account/sign-up", {
        method: "POST",
        body: JSON.stringify({ name: "Burst", email: `${tag}-${i}@example.com`, password: "a-fine-long-password" }),
        headers: { "content-type": "application/json", "x-forwarded-for": from },
      }));
    const statuses = await withTrustProxy("1", async () => {
      const out: number[] = [];
      for (let i = 0; i < 30; i++) out.push((await signUp(i)).status);
      const refused = await signUp(30);
      expect(refused.status).toBe(429);
      expect(Number(refused.headers.get("retry-after"))).toBeGreaterThan(0);
      expect((await refused.json()).error.code).toBe("rate_limited");
      return out;
    });
    expect(new Set(statuses)).toEqual(new Set([201]));
    expect(await db.select().from(users).where(like(users.email, `${tag}-%`))).toHaveLength(30);
    expect(await db.select().from(users).where(eq(users.email, `${tag}-30@example.com`))).toEqual([]);
  });

  it("push answers 429 with Retry-After past 120 a minute for one account", async () => {
    const email = await makeAccount("pusher", "x");
    const [row] = await db.select().from(users).where(eq(users.email, email));
    actAs({ id: row!.id, email, name: row!.name, role: "member" });
    const dev = deviceId();
    const statuses: number[] = [];
    for (let i = 0; i < 120; i++) statuses.push((await push({ deviceId: dev, sessions: [], runs: [], events: [] })).status);
    expect(new Set(statuses)).toEqual(new Set([200]));
    const refused = await pushRoute(pushRequest({ deviceId: dev, sessions: [], runs: [], events: [] }));
    expect(refused.status).toBe(429);
    expect(Number(refused.headers.get("retry-after"))).toBeGreaterThan(0);
    expect((await refused.json()).error.code).toBe("rate_limited");
  });
});
