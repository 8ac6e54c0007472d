/**
 * Season bench: `npm run bench` (or `npx tsx --conditions=react-server bench/season.bench.ts` with
 * DATABASE_URL set to a migrated database). Seeds a season of SEASON_BENCH_RUNS runs × 6 flights
 * (5,000 / 30,000) for one new pilot, then prints:
 *  1. the season summary's p95 (every chart in one statement, db/queries/season) against a bare
 *     COUNT(*) of the same lanes — goal ≤ 10×; the runs table's first page beside it;
 *  2. the season endpoint over HTTP (signed in, production build): p95 against a bare COUNT(*) measured in turns
 *     with it — goal ≤ 10× (the number is the endpoint's);
 *  3. /season's first-load JavaScript (gzip) against the empty page.
 */
import os from "node:os";
import { sql } from "drizzle-orm";
import { db, getPool } from "@/db";
import { getSeasonSummary } from "@/db/queries/season/summary";
import { listSeasonRuns } from "@/db/queries/season/tables";
import { seedBenchSeason } from "./season-seed";
import { signIn, startServer } from "./next-server";
import { firstLoadJs } from "./season-server";

const RUNS = Number(process.env.SEASON_BENCH_RUNS ?? 5000);
const ROUNDS = Number(process.env.SEASON_BENCH_ROUNDS ?? 40);
const PASSWORD = "season-bench-thermals";

const quantile = (xs: number[], q: number) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.ceil(xs.length * q) - 1)]!;
const p95 = (xs: number[]) => quantile(xs, 0.95);
/** p95 of each function's time, measured in turns (a, b, a, b…) so both meet the same load on a shared machine. */
async function timedInTurns(fns: (() => Promise<unknown>)[], rounds = ROUNDS): Promise<number[]> {
  return (await samplesInTurns(fns, rounds)).map(p95);
}
/** Each function's times, measured in turns. */
async function samplesInTurns(fns: (() => Promise<unknown>)[], rounds = ROUNDS): Promise<number[][]> {
  for (let i = 0; i < 3; i++) for (const fn of fns) await fn(); // warm: plans and caches
  const out = fns.map(() => [] as number[]);
  for (let i = 0; i < rounds; i++) {
    for (const [k, fn] of fns.entries()) {
      const t = performance.now();
      await fn();
      out[k]!.push(performance.now() - t);
    }
  }
  return out;
}
const ms = (n: number) => `${n.toFixed(1)} ms`;

console.log(`machine: ${os.cpus().length} cores, load ${os.loadavg()[0]!.toFixed(2)}`);
const t0 = performance.now();
const { pilotId, email } = await seedBenchSeason({ runs: RUNS, flights: 6, password: PASSWORD });
const counted = await db.execute<{ lanes: number; flights: number }>(sql`
  select count(*)::int as lanes, sum(jsonb_array_length(derived -> 'flights'))::int as flights from run_lanes where pilot_user_id = ${pilotId}`);
console.log(`seeded ${counted.rows[0]!.lanes} runs / ${counted.rows[0]!.flights} flights for one pilot in ${((performance.now() - t0) / 1000).toFixed(0)} s`);

// the statistics a running database has (autovacuum would gather them some time during the rounds, changing the plans midway)
await db.execute(sql`vacuum analyze run_lanes, runs, lane_flights, field_sessions, lane_consents`);

try {
  const filters = { kind: "all" as const };
  // the COUNT(*) is over the same rows the summary aggregates: every seeded lane, each counted by the summary too
  const same = await getSeasonSummary(db, { pilotId, filters, now: new Date() });
  if (same.totals.runs !== counted.rows[0]!.lanes || same.totals.flights !== counted.rows[0]!.flights) {
    throw new Error(`the summary counts ${same.totals.runs} runs / ${same.totals.flights} flights, the COUNT(*) ${counted.rows[0]!.lanes} / ${counted.rows[0]!.flights}`);
  }
  const bareCount = () => db.execute(sql`select count(*) from run_lanes l join runs r on r.id = l.run_id where l.pilot_user_id = ${pilotId}`);
  const [count, summary, page] = await timedInTurns([
    bareCount,
    () => getSeasonSummary(db, { pilotId, filters, now: new Date() }),
    () => listSeasonRuns(db, { pilotId, filters, paging: { sort: "result", dir: "desc", page: 1, size: 25 } }),
  ]);
  const ratio = summary! / count!;
  console.log(`${ratio <= 10 ? "  met " : "MISSED"}  season summary p95 ${ms(summary!)} = ${ratio.toFixed(1)}× a bare COUNT(*) of the same lanes (p95 ${ms(count!)})   [goal ≤ 10×]`);
  console.log(`        runs table, first page sorted by result: p95 ${ms(page!)} = ${(page! / count!).toFixed(1)}× the COUNT(*)   (load ${os.loadavg()[0]!.toFixed(2)} after)`);

  if (process.env.SEASON_BENCH_HTTP === "0") process.exit(0); // the database part only (no build needed)
  const { base, server } = await startServer("/api/health");
  try {
    const cookie = await signIn(base, email, PASSWORD);
    const endpoint = async () => {
      const res = await fetch(`${base}/api/pilots/${pilotId}/season`, { headers: { cookie } });
      if (!res.ok) throw new Error(`season endpoint answered ${res.status}`);
      return res.text();
    };
    const served = JSON.parse(await endpoint()) as { totals: { runs: number; flights: number } };
    if (served.totals.runs !== same.totals.runs || served.totals.flights !== same.totals.flights) throw new Error("the endpoint counts other totals than the summary");
    // the endpoint in turns with its own COUNT(*), so both meet the same load (the goal is the endpoint's)
    const [countTimes, httpTimes] = await samplesInTurns([bareCount, endpoint]);
    const [httpCount, http] = [p95(countTimes!), p95(httpTimes!)];
    const httpRatio = http / httpCount;
    console.log(`${httpRatio <= 10 ? "  met " : "MISSED"}  GET /api/pilots/[pilotId]/season over HTTP (signed in): p95 ${ms(http)} = ${httpRatio.toFixed(1)}× the COUNT(*) measured in turns with it (p95 ${ms(httpCount)})   [goal ≤ 10×; load ${os.loadavg()[0]!.toFixed(2)}]`);
    // under load the COUNT's p95 swings most (its rare slow turns), flattering the p95 ratio: the medians' beside it
    console.log(`        the same at the median: ${ms(quantile(httpTimes!, 0.5))} = ${(quantile(httpTimes!, 0.5) / quantile(countTimes!, 0.5)).toFixed(1)}× the COUNT(*)'s ${ms(quantile(countTimes!, 0.5))}`);
    const js = await firstLoadJs(base, "/season", cookie);
    console.log(`        /season first-load JS ${(js.page / 1000).toFixed(1)} kB gzip (${(js.page / js.empty).toFixed(2)}× the empty page's ${(js.empty / 1000).toFixed(1)} kB; the charts load after)`);
  } finally {
    server.kill("SIGTERM");
  }
} finally {
  await getPool().end();
}
