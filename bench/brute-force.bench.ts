/**
 * Brute-force benchmark: `npx tsx --conditions=react-server bench/brute-force.bench.ts` with
 * DATABASE_URL set (a migrated database; it makes its own account). On loopback, in process:
 * 1,000 wrong guesses against one account through authorizeCredentials (what
 * POST /api/auth/callback/credentials calls), sent 10 at a time from 25 addresses behind a trusted
 * proxy (TRUST_PROXY=1, X-Forwarded-For as the proxy would set it), while the owner signs in from a
 * clean address after every 50 guesses. The owner must get in every time (exit 1 otherwise). Prints
 * how many guesses reached the password check, per minute of the run, and the ratio of a refused
 * guess's cost to a checked one's (refusals skip argon2id).
 */
import { getPool } from "@/db";
import { authorizeCredentials } from "@/lib/auth/authorize";
import { freshAddress, makeAccount } from "../tests/integration/support/accounts";

type Outcome = "signed in" | "wrong" | "throttled";

async function attempt(email: string, password: string, forwardedFor: string): Promise<Outcome> {
  try {
    return (await authorizeCredentials({ email, password }, { "x-forwarded-for": forwardedFor })) ? "signed in" : "wrong";
  } catch (error) {
    if (error instanceof Error && error.message.startsWith("throttled")) return "throttled";
    throw error;
  }
}

const GUESSES = Number(process.env.BRUTE_BENCH_GUESSES ?? 1000);
const ADDRESSES = 25;
const AT_ONCE = 10;
const OWNER_EVERY = 50;
const PASSWORD = "owner-knows-this-one";

process.env.TRUST_PROXY = "1";

async function run() {
  const email = await makeAccount("brute", PASSWORD);
  const strangers = Array.from({ length: ADDRESSES }, freshAddress);
  const ownerAddress = freshAddress();
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
        const outcome = await attempt(email, `guess-${n}`, `198.51.100.${n % 256}, ${strangers[n % ADDRESSES]}`);
        ms[outcome].push(performance.now() - start);
        counts[outcome] += 1;
        if (outcome === "wrong" && n >= GUESSES / 10) late += 1;
      }),
    );
    if ((sent + AT_ONCE) % OWNER_EVERY === 0) {
      owner += 1;
      if ((await attempt(email, PASSWORD, ownerAddress)) !== "signed in") ownerRefused += 1;
    }
  }
  const minutes = (performance.now() - t0) / 60_000;
  const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / Math.max(1, xs.length);
  console.log(
    `brute force: ${GUESSES} wrong guesses from ${ADDRESSES} addresses in ${(minutes * 60).toFixed(1)} s; ` +
      `${counts.wrong} reached the password check (${(counts.wrong / minutes).toFixed(0)} per minute of this run, ` +
      `${((counts.wrong / GUESSES) * 100).toFixed(1)}% of guesses), ${counts.throttled} refused, ${counts["signed in"]} signed in`,
  );
  console.log(`  of the last ${GUESSES - GUESSES / 10} guesses ${late} reached the check (${(late / minutes).toFixed(0)} per minute)`);
  console.log(
    `  a refused guess costs ${(mean(ms.throttled) / mean(ms.wrong)).toFixed(2)}× a checked one ` +
      `(${mean(ms.throttled).toFixed(1)} ms vs ${mean(ms.wrong).toFixed(1)} ms, 10 at once)`,
  );
  console.log(`  the owner, from a clean address, signed in ${owner - ownerRefused} of ${owner} times`);
  if (ownerRefused > 0 || counts["signed in"] > 0) process.exitCode = 1;
}

try {
  await run();
} finally {
  await getPool().end();
}
