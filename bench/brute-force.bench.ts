/**
 * Brute-force benchmark: `npx tsx --conditions=react-server bench/brute-force.bench.ts` with
 * DATABASE_URL and NEXTAUTH_SECRET set (a migrated database; it makes its own accounts). On loopback,
 * in process, through authorizeCredentials (what POST /api/auth/callback/credentials calls):
 * - behind a trusted proxy (TRUST_PROXY=1): 1,000 wrong guesses against one account, sent 10 at a time
 *   from 25 addresses (X-Forwarded-For as the proxy would set it), while the owner signs in from a clean
 *   address after every 50 guesses;
 * - without a proxy (TRUST_PROXY unset, every request in one address bucket): the same guesses, while
 *   the owner signs in from a phone that signed in before (its known-device cookie) after every 50,
 *   and a browser without the cookie tries the right password too (it shares the strangers' bucket).
 * The owner must get in every time (exit 1 otherwise). Prints how many guesses reached the password
 * check, per minute of the run, and the ratio of a refused guess's cost to a checked one's.
 */
import { getPool } from "@/db";
import { freshAddress, makeAccount } from "../tests/integration/support/accounts";
import { attempt, newJar, type Outcome } from "../tests/integration/support/sign-in";

const GUESSES = Number(process.env.BRUTE_BENCH_GUESSES ?? 1000);
const ADDRESSES = 25;
const AT_ONCE = 10;
const OWNER_EVERY = 50;
const PASSWORD = "owner-knows-this-one";

async function run(proxied: boolean) {
  if (proxied) process.env.TRUST_PROXY = "1";
  else delete process.env.TRUST_PROXY;
  const email = await makeAccount("brute", PASSWORD);
  const strangers = Array.from({ length: ADDRESSES }, freshAddress);
  const ownerAddress = freshAddress();
  const phone = newJar(); // without a proxy the owner uses a phone that signed in before
  if (!proxied && (await attempt(email, PASSWORD, undefined, phone)) !== "signed in") throw new Error("the owner's first sign-in failed");
  let stranger = 0; // without a proxy: a browser without the cookie, typing the right password
  const counts: Record<Outcome, number> = { "signed in": 0, wrong: 0, throttled: 0 };
  const ms: Record<Outcome, number[]> = { "signed in": [], wrong: [], throttled: [] };
  let owner = 0;
  let ownerRefused = 0;
  let late = 0; // checked guesses among the last nine tenths: the steady rate once the attack is seen
  const t0 = performance.now();
  for (let sent = 0; sent < GUESSES; sent += AT_ONCE) {
    await Promise.all(
      Array.from({ length: Math.min(AT_ONCE, GUESSES - sent) }, async (_, i) => {
        const n = sent + i;
        const start = performance.now();
        const outcome = await attempt(email, `guess-${n}`, proxied ? `198.51.100.${n % 256}, ${strangers[n % ADDRESSES]}` : undefined);
        ms[outcome].push(performance.now() - start);
        counts[outcome] += 1;
        if (outcome === "wrong" && n >= GUESSES / 10) late += 1;
      }),
    );
    if ((sent + AT_ONCE) % OWNER_EVERY === 0) {
      owner += 1;
      if ((await attempt(email, PASSWORD, proxied ? ownerAddress : undefined, proxied ? undefined : phone)) !== "signed in") ownerRefused += 1;
      if (!proxied && (await attempt(email, PASSWORD, undefined, newJar())) === "signed in") stranger += 1;
    }
  }
  const minutes = (performance.now() - t0) / 60_000;
  const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / Math.max(1, xs.length);
  const from = proxied ? `${ADDRESSES} addresses behind a trusted proxy` : "one unseen address (no TRUST_PROXY)";
  console.log(
    `brute force, ${from}: ${GUESSES} wrong guesses in ${(minutes * 60).toFixed(1)} s; ` +
      `${counts.wrong} reached the password check (${(counts.wrong / minutes).toFixed(0)} per minute of this run, ` +
      `${((counts.wrong / GUESSES) * 100).toFixed(1)}% of guesses), ${counts.throttled} refused, ${counts["signed in"]} signed in`,
  );
  console.log(`  of the last ${GUESSES - GUESSES / 10} guesses ${late} reached the check (${(late / minutes).toFixed(0)} per minute)`);
  console.log(
    `  a refused guess costs ${(mean(ms.throttled) / mean(ms.wrong)).toFixed(2)}× a checked one ` +
      `(${mean(ms.throttled).toFixed(1)} ms vs ${mean(ms.wrong).toFixed(1)} ms, 10 at once)`,
  );
  const ownerFrom = proxied ? "from a clean address" : "on a phone with its known-device cookie";
  console.log(`  the owner, ${ownerFrom}, signed in ${owner - ownerRefused} of ${owner} times`);
  if (!proxied) console.log(`  the right password from a browser without the cookie got in ${stranger} of ${owner} times (the shared bucket is slowed)`);
  if (ownerRefused > 0 || counts["signed in"] > 0) process.exitCode = 1;
}

try {
  await run(true);
  await run(false);
} finally {
  await getPool().end();
}
