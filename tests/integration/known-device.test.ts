import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import { rateLimits } from "@/db/schema";
import { db, getPool } from "./support/db";
import { freshAddress, makeAccount, withTrustProxy } from "./support/accounts";
import { attempt, newJar, type Outcome } from "./support/sign-in";

afterAll(async () => {
  await getPool().end();
});

const RIGHT = "thermal-over-the-car-park";

/** Fifty wrong guesses against `email`, one after another, from the request's only bucket. */
async function strangerFails(email: string, forwardedFor?: string): Promise<Outcome[]> {
  const out: Outcome[] = [];
  for (let i = 0; i < 50; i++) out.push(await attempt(email, `stranger-${i}`, forwardedFor));
  return out;
}

describe("known-device cookie (lib/auth/known-device.ts)", () => {
  it("without TRUST_PROXY a stranger's failures do not hold up the owner's phone that signed in before", async () => {
    const email = await makeAccount("known", RIGHT);
    const phone = newJar();
    await withTrustProxy(null, async () => {
      expect(await attempt(email, RIGHT, undefined, phone)).toBe("signed in");
      expect(Object.keys(phone.cookies)).toHaveLength(1);
      // every request without a proxy falls into the one "local" bucket for this account
      const outcomes = await strangerFails(email);
      expect(outcomes.filter((o) => o === "wrong")).toHaveLength(3);
      // the owner's phone carries its cookie: its own bucket, in at once
      expect(await attempt(email, RIGHT, undefined, phone)).toBe("signed in");
      // a browser without it is in the stranger's bucket, slowed as before
      expect(await attempt(email, RIGHT, undefined, newJar())).toBe("throttled");
      // a spoofed X-Forwarded-For without TRUST_PROXY is no way out of it either
      expect(await attempt(email, RIGHT, freshAddress())).toBe("throttled");
    });
  });

  it("a known device is still slowed by its own failures", async () => {
    const email = await makeAccount("known-typo", RIGHT);
    const phone = newJar();
    await withTrustProxy(null, async () => {
      expect(await attempt(email, RIGHT, undefined, phone)).toBe("signed in");
      for (let i = 0; i < 3; i++) expect(await attempt(email, `typo-${i}`, undefined, phone)).toBe("wrong");
      expect(await attempt(email, RIGHT, undefined, phone)).toBe("throttled");
    });
  });

  it("a cookie counts only for the account it names, and only with a valid signature", async () => {
    const victim = await makeAccount("victim", RIGHT);
    const attacker = await makeAccount("attacker", RIGHT);
    const own = newJar();
    await withTrustProxy(null, async () => {
      expect(await attempt(attacker, RIGHT, undefined, own)).toBe("signed in");
      const victimPhone = newJar();
      expect(await attempt(victim, RIGHT, undefined, victimPhone)).toBe("signed in");
      await strangerFails(victim);
      const [[attackerName, attackerValue]] = Object.entries(own.cookies) as [[string, string]];
      const [[victimName, victimValue]] = Object.entries(victimPhone.cookies) as [[string, string]];
      // the attacker's own cookie, sent as is or under the victim's cookie name, opens nothing
      expect(await attempt(victim, "guess-a", undefined, { cookies: { [attackerName]: attackerValue } })).toBe("throttled");
      expect(await attempt(victim, "guess-b", undefined, { cookies: { [victimName]: attackerValue } })).toBe("throttled");
      // nor does the victim's device id with a forged signature
      const forged = `${victimValue.split(".")[0]}.${"A".repeat(43)}`;
      expect(await attempt(victim, "guess-c", undefined, { cookies: { [victimName]: forged } })).toBe("throttled");
      expect(await attempt(victim, RIGHT, undefined, victimPhone)).toBe("signed in");
    });
  });

  it("behind a trusted proxy the owner's known phone gets in even from an address that failed for the account", async () => {
    const email = await makeAccount("known-proxy", RIGHT);
    const hotspot = freshAddress();
    const phone = newJar();
    await withTrustProxy("1", async () => {
      expect(await attempt(email, RIGHT, hotspot, phone)).toBe("signed in");
      await strangerFails(email, hotspot);
      expect(await attempt(email, RIGHT, hotspot)).toBe("throttled");
      expect(await attempt(email, RIGHT, hotspot, phone)).toBe("signed in");
    });
  });
});

describe("rate_limits keys", () => {
  it("hold no e-mail address: accounts are keyed by an HMAC of the lower-cased address", async () => {
    const email = await makeAccount("hashed", RIGHT);
    await withTrustProxy(null, () => attempt(email.toUpperCase(), "wrong-password"));
    await withTrustProxy("1", () => attempt(email, "wrong-password", freshAddress()));
    const local = email.split("@")[0]!;
    const rows = await db.select({ key: rateLimits.key }).from(rateLimits).where(sql`lower(${rateLimits.key}) like ${`%${local}%`}`);
    expect(rows).toEqual([]);
  });
});
