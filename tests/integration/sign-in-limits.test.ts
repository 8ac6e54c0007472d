import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { rateLimits } from "@/db/schema";
import { signInPairKey } from "@/lib/auth/attempts";
import { db, getPool } from "./support/db";
import { freshAddress, makeAccount, withTrustProxy } from "./support/accounts";
import { attempt, type Outcome } from "./support/sign-in";

afterAll(async () => {
  await getPool().end();
});

const RIGHT = "ridge-lift-at-noon";
const tally = (outcomes: Outcome[]) => ({
  wrong: outcomes.filter((o) => o === "wrong").length,
  throttled: outcomes.filter((o) => o === "throttled").length,
});

describe("sign-in attempt limits (lib/auth/attempts.ts)", () => {
  it("a stranger failing from many addresses does not stop the owner signing in from a clean one", async () => {
    const email = await makeAccount("owner", RIGHT);
    await withTrustProxy("1", async () => {
      const strangers = Array.from({ length: 10 }, freshAddress);
      for (const from of strangers) for (let i = 0; i < 3; i++) await attempt(email, `guess-${i}-${from}`, from);
      // 30 failures: the account is under attack, so an address that failed for it is refused outright
      expect(await attempt(email, "one-more-guess", strangers[0])).toBe("throttled");
      expect(await attempt(email, RIGHT, freshAddress())).toBe("signed in");
      // the owner's success does not reopen the strangers' addresses; a new one gets a single guess
      expect(await attempt(email, "one-more-guess", strangers[1])).toBe("throttled");
      const newcomer = freshAddress();
      expect(await attempt(email, "another-guess", newcomer)).toBe("wrong");
      expect(await attempt(email, "another-guess-2", newcomer)).toBe("throttled");
    });
  });

  it("failures of one account do not hold up another account behind the same address", async () => {
    // no TRUST_PROXY: every request is the one unknown address, as on loopback
    await withTrustProxy(null, async () => {
      const clumsy = await Promise.all(Array.from({ length: 12 }, (_, i) => makeAccount(`clumsy${i}`, RIGHT)));
      for (const email of clumsy) for (let i = 0; i < 4; i++) await attempt(email, `typo-${i}`);
      const careful = await makeAccount("careful", RIGHT);
      expect(await attempt(careful, RIGHT)).toBe("signed in");
      // and each clumsy pilot is only slowed down on their own account
      expect(await attempt(clumsy[0]!, RIGHT)).toBe("throttled");
    });
  });

  it("a club behind one phone's hotspot, mistyping, never locks each other out", async () => {
    const hotspot = freshAddress();
    await withTrustProxy("1", async () => {
      const club = await Promise.all(Array.from({ length: 15 }, (_, i) => makeAccount(`club${i}`, RIGHT)));
      for (const email of club) for (let i = 0; i < 2; i++) expect(await attempt(email, `typo-${i}`, hotspot)).toBe("wrong");
      for (const email of club) expect(await attempt(email, RIGHT, hotspot)).toBe("signed in");
    });
  });

  it("without TRUST_PROXY a client's X-Forwarded-For cannot frame another address", async () => {
    // Next fills X-Forwarded-For with the socket's address only when the client sent none, so a
    // stranger can write anyone's address there; the victim's own requests carry their real one.
    const victim = freshAddress();
    await withTrustProxy(null, async () => {
      const targets = await Promise.all(Array.from({ length: 12 }, (_, i) => makeAccount(`spoof${i}`, RIGHT)));
      for (const email of targets) for (let i = 0; i < 3; i++) await attempt(email, `guess-${i}`, victim);
      const mine = await makeAccount("framed", RIGHT);
      expect(await attempt(mine, RIGHT, victim)).toBe("signed in");
    });
  });

  it("without TRUST_PROXY a fresh X-Forwarded-For on every guess gives no fresh allowance", async () => {
    const email = await makeAccount("rotating", RIGHT);
    const outcomes = await withTrustProxy(null, async () => {
      const out: Outcome[] = [];
      for (let i = 0; i < 8; i++) out.push(await attempt(email, `guess-${i}`, freshAddress()));
      return out;
    });
    expect(outcomes.slice(0, 3)).toEqual(["wrong", "wrong", "wrong"]);
    expect(tally(outcomes)).toEqual({ wrong: 3, throttled: 5 });
  });

  it("behind a trusted proxy the address is the proxy's entry, not one the client wrote in front", async () => {
    // A stranger names the victim's address in X-Forwarded-For; the proxy appends the stranger's own.
    const victim = freshAddress();
    const stranger = freshAddress();
    await withTrustProxy("1", async () => {
      const targets = await Promise.all(Array.from({ length: 12 }, (_, i) => makeAccount(`framed${i}`, RIGHT)));
      for (const email of targets) for (let i = 0; i < 3; i++) await attempt(email, `guess-${i}`, `${victim}, ${stranger}`);
      const mine = await makeAccount("victim", RIGHT);
      expect(await attempt(mine, RIGHT, victim)).toBe("signed in");
    });
  });

  it("guesses sent at once are counted before the password check: at most three get through", async () => {
    const email = await makeAccount("raced", RIGHT);
    const outcomes = await withTrustProxy(null, () => Promise.all(Array.from({ length: 20 }, (_, i) => attempt(email, `guess-${i}`))));
    expect(tally(outcomes)).toEqual({ wrong: 3, throttled: 17 });
  });

  it("an unknown account is counted exactly like an existing one, so limits reveal nothing", async () => {
    const real = await makeAccount("real", RIGHT);
    const ghost = `ghost-${freshAddress()}@example.com`;
    const run = (email: string) => withTrustProxy(null, async () => {
      const out: Outcome[] = [];
      for (let i = 0; i < 5; i++) out.push(await attempt(email, `guess-${i}`));
      return out;
    });
    expect(await run(ghost)).toEqual(await run(real));
  });

  it("after three failures a pair waits, and each wait doubles", async () => {
    const email = await makeAccount("waits", RIGHT);
    const gate = `pair-gate:${signInPairKey(email, null)}`;
    const waitLeft = async () => ((await db.select().from(rateLimits).where(eq(rateLimits.key, gate)))[0]?.expire ?? 0) - Date.now();
    const openGate = () => db.update(rateLimits).set({ expire: Date.now() - 1 }).where(eq(rateLimits.key, gate));
    await withTrustProxy(null, async () => {
      for (let i = 0; i < 3; i++) expect(await attempt(email, `typo-${i}`)).toBe("wrong");
      expect(await attempt(email, RIGHT)).toBe("throttled");
      expect(await waitLeft()).toBeGreaterThan(50_000);
      expect(await waitLeft()).toBeLessThanOrEqual(60_000);
      await openGate(); // as if the minute had passed
      expect(await attempt(email, "typo-3")).toBe("wrong");
      expect(await waitLeft()).toBeGreaterThan(110_000);
      expect(await waitLeft()).toBeLessThanOrEqual(120_000);
      await openGate();
      expect(await attempt(email, RIGHT)).toBe("signed in");
      // a success clears the pair: three free attempts again
      for (let i = 0; i < 3; i++) expect(await attempt(email, `typo-again-${i}`)).toBe("wrong");
    });
  });
});
