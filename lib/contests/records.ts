/**
 * A pilot's round with two records (a slot's or a re-flight grant's) that the officer has not decided
 * between yet: the standings count the record the slot or grant holds now, and the results say it may
 * change (db/queries/contest-records.ts, `RoundCell.undecided`).
 */
export const RECORDS_UNDECIDED = "two records, not decided yet";
