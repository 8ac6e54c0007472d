import { randomUUID } from "node:crypto";
import type pg from "pg";

/**
 * A trial contest of the demo club written straight into the database, for specs that start on its
 * round pages: five rounds (tasks A, B, D, F, H, copied from the seeded contest's rounds), no entries.
 * Returns the contest and its first round. `name` gets a random suffix, so reruns do not collide.
 */
export async function insertTrialContest(
  db: pg.Client,
  o: { name: string; startsOn: string; drawSeed: number; publicToken?: string },
): Promise<{ contestId: string; round1: string }> {
  const { rows: [club] } = await db.query<{ id: string }>("select id from clubs where slug = 'heronmoor'");
  const { rows: [c] } = await db.query<{ id: string }>(
    "insert into contests (club_id, name, starts_on, field_name, draw_seed, public_token) values ($1, $2, $3, 'Five Acre Meadow', $4, $5) returning id",
    [club!.id, `${o.name} ${randomUUID().slice(0, 6)}`, o.startsOn, o.drawSeed, o.publicToken ?? null],
  );
  let round1 = "";
  for (const [i, letter] of ["A", "B", "D", "F", "H"].entries()) {
    const { rows: [r] } = await db.query<{ id: string }>(
      "insert into contest_rounds (contest_id, number, task) select $1, $2, task from contest_rounds where task ->> 'letter' = $3 limit 1 returning id",
      [c!.id, i + 1, letter],
    );
    if (i === 0) round1 = r!.id;
  }
  return { contestId: c!.id, round1 };
}
