import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/db";
import { listContestDisputes } from "@/db/queries/contest-disputes";
import { listDrawChanges } from "@/db/queries/contest-draw-changes";
import { applyPaymentChange } from "@/db/queries/contest-payments";
import { contestTimeZone, getContest, listSlots } from "@/db/queries/contests";
import { listModels } from "@/db/queries/models";
import { hasClubRole } from "@/lib/clubs/roles";
import { formatClock, formatDate } from "@/lib/format";
import { entriesOpen, formatFee, paymentLabel, refundOnWithdrawal } from "@/lib/payments/fees";
import { sessionChange } from "@/lib/payments/server/checkout";
import { contestIdSchema } from "@/lib/validations/contests";
import { contestPageAccess } from "../_components/guard";
import { ActionButton, EnterForm, PaperEntryForm, EntryDetails } from "./_components/actions";
import { DrawButton } from "./_components/draw-button";
import { DrawChanges } from "./_components/draw-changes";
import { DrawChangeList, DrawLists } from "./_components/draw-lists";
import { MyFee, OfficerFees } from "./_components/fees";
import { ContestDisputes } from "./_components/disputes-list";
import { DrawFlyOff } from "./_components/fly-off";

const HALVES_WORDS = { "half-up": "exact halves of 0.1 point round up", "half-even": "exact halves of 0.1 point round to even", down: "points cut off at 0.1" } as const;

type Search = Promise<{ payment?: string | string[]; session_id?: string | string[] }>;

export const metadata: Metadata = { title: "Contest" };
export const dynamic = "force-dynamic";

/** A contest: its set-up, entries (the officer adds paper entries and withdraws), the draw per round; the officers' list of disputes. */
export default async function ContestPage({ params, searchParams }: { params: Promise<{ contestId: string }>; searchParams: Search }) {
  const parsed = contestIdSchema.safeParse(await params);
  if (!parsed.success) notFound();
  const { contestId } = parsed.data;
  const me = await contestPageAccess({ contestId, role: "member", back: `/contests/${contestId}` });
  const [found, zone] = await Promise.all([getContest(db, contestId), contestTimeZone(db, contestId)]);
  if (!found) notFound();
  const { contest, rounds, flyOffRounds } = found;
  let { entries } = found;
  const officer = me.role === "admin" || hasClubRole(me.clubRole, "officer");
  const search = await searchParams;
  const returned = search.payment === "done" ? "done" : search.payment === "cancelled" ? "cancelled" : null;
  const ownEntry = entries.find((e) => !e.withdrawnAt && e.pilotUserId === me.id);
  // back from paying: ask the payments service about this session (the webhook may not have arrived yet); the same rule applies
  if (ownEntry && returned === "done" && typeof search.session_id === "string" && /^cs_\w{1,200}$/.test(search.session_id) && ownEntry.paymentStatus !== "paid") {
    const change = await sessionChange(search.session_id, ownEntry.id).catch(() => null);
    if (change && (await applyPaymentChange(db, change))) entries = (await getContest(db, contestId))?.entries ?? entries;
  }
  const live = entries.filter((e) => !e.withdrawnAt);
  const mine = live.find((e) => e.pilotUserId === me.id);
  const open = entriesOpen(contest, new Date());
  const models = mine ? [] : (await listModels(db, { ownerId: me.id })).filter((m) => m.status !== "retired").map((m) => ({ id: m.id, name: m.name }));
  const slots = contest.drawSeed === null ? [] : await listSlots(db, contestId);
  const flyOffSlots = flyOffRounds.length === 0 ? [] : await listSlots(db, contestId, true);
  const flyOffPilots = [...new Set(flyOffSlots.map((s) => s.entryId))];
  const changes = contest.drawSeed === null ? [] : await listDrawChanges(db, contestId);
  const disputes = officer && contest.drawSeed !== null ? await listContestDisputes(db, contestId) : [];
  const names = new Map(entries.map((e) => [e.id, e.pilotName]));
  const letters = new Map(rounds.map((r) => [r.number, r.task.letter ?? "custom"]));
  return (
    <div className="space-y-8">
      <header className="space-y-1">
        <h1 className="text-2xl font-extrabold">{contest.name}</h1>
        <p className="text-muted">{formatDate(new Date(`${contest.startsOn}T12:00:00Z`))} · {contest.fieldName} · {me.club.name}{contest.practice ? " · practice event" : ""}</p>
        <p className="flex flex-wrap gap-x-4">
          <Link className="inline-flex min-h-12 items-center font-bold underline" href={`/contests/${contestId}/results`}>Results</Link>
          <Link className="inline-flex min-h-12 items-center underline" href={`/contests/${contestId}/sheets`}>Group lists and scoresheets</Link>
        </p>
        {(contest.entryFeeCents !== null || contest.entriesCloseAt) && (
          <p>{contest.entryFeeCents !== null ? `Entry fee ${formatFee(contest.entryFeeCents, contest.currency)}` : "No entry fee"}
            {contest.entriesCloseAt && ` · entries close ${formatClock(contest.entriesCloseAt, zone)}${contest.entryFeeCents !== null ? " (withdrawals before then are refunded)" : ""}`}</p>
        )}
        <p className="text-sm">Groups of at most {contest.maxGroupSize} · preparation {contest.prepMinutes} min · no-fly {contest.noFlySeconds} s · {contest.dropRule === "f3k" ? "lowest round dropped from 6 rounds" : "every round counts"} · {HALVES_WORDS[contest.halves]} · rules {contest.rulesEdition.replace("-", " ")}</p>
      </header>
      <section aria-labelledby="rounds" className="space-y-2">
        <h2 id="rounds" className="text-lg font-bold">Rounds</h2>
        <ol className="list-decimal pl-5" aria-label="Rounds">
          {rounds.map((r) => (
            <li key={r.id}>Task {r.task.letter}: {r.task.name}
              {officer && contest.drawSeed !== null && <> · <Link className="inline-flex min-h-12 items-center underline" href={`/contests/${contestId}/rounds/${r.number}`}>Timekeepers for round {r.number}</Link> · <Link className="inline-flex min-h-12 items-center underline" href={`/contests/${contestId}/rounds/${r.number}/cards`}>Paper cards for round {r.number}</Link></>}
            </li>
          ))}
        </ol>
      </section>
      <section aria-labelledby="entries" className="space-y-2">
        <h2 id="entries" className="text-lg font-bold">Entries ({live.length})</h2>
        <ul aria-label="Entries" className="space-y-1">
          {live.map((e) => (
            <li key={e.id}>{e.pilotName}{e.paper ? " (paper)" : ""}{e.pilotClass === "junior" ? " · junior" : ""}{e.team ? ` · team ${e.team}` : ""}{e.models.length > 0 ? ` · ${e.models.map((m) => m.name).join(", ")}` : ""}
              {officer && contest.entryFeeCents !== null && ` · ${paymentLabel(e)}`}
              {officer && contest.drawLockedAt === null && <> · <ActionButton label={`Withdraw ${e.pilotName}`} method="DELETE" url={`/api/contests/${contestId}/entries/${e.id}`} /></>}
              {officer && <EntryDetails contestId={contestId} entryId={e.id} pilotName={e.pilotName} team={e.team} pilotClass={e.pilotClass} />}
            </li>
          ))}
        </ul>
        {mine ? <><p>You are entered.</p><MyFee contest={contest} mine={mine} returned={returned} />
          {open && contest.drawLockedAt === null && (
            <p><ActionButton label={refundOnWithdrawal(mine, contest, new Date()) ? "Withdraw my entry (the card payment is refunded)" : "Withdraw my entry"} method="DELETE" url={`/api/contests/${contestId}/entries/${mine.id}`} /></p>
          )}</>
          : open ? <EnterForm contestId={contestId} models={models} fee={contest.entryFeeCents === null ? null : formatFee(contest.entryFeeCents, contest.currency)} />
          : <p>Entries are closed.</p>}
        {officer && <PaperEntryForm contestId={contestId} />}
      </section>
      {officer && <OfficerFees contest={contest} entries={entries} />}
      <section aria-labelledby="draw" className="space-y-2">
        <h2 id="draw" className="text-lg font-bold">The draw</h2>
        {contest.drawSeed === null ? <p className="text-muted">Not drawn yet.</p> : <p>Seed {contest.drawSeed}{contest.drawLockedAt ? " · locked" : ""}</p>}
        {officer && contest.drawLockedAt === null && (
          <p className="space-x-4">
            <DrawButton contestId={contestId} label={contest.drawSeed === null ? "Make the draw" : "Draw again"} />
            {contest.drawSeed !== null && <ActionButton label="Lock the draw" method="POST" url={`/api/contests/${contestId}/draw/lock`} />}
          </p>
        )}
        <DrawLists slots={slots} names={names} letters={letters} />
        <DrawChangeList changes={changes.map((c) => ({ id: c.id, summary: c.summary, by: c.by, at: formatClock(c.at, zone, "short") }))} />
        {officer && slots.length > 0 && (
          <DrawChanges contestId={contestId} slots={slots} names={Object.fromEntries(names)} rounds={rounds.map((r) => r.number)} />
        )}
      </section>
      {flyOffRounds.length > 0 && (
        <section aria-labelledby="fly-off" className="space-y-2">
          <h2 id="fly-off" className="text-lg font-bold">Fly-off</h2>
          <p className="text-sm">
            The best {contest.flyOffPilots ?? "?"} pilots of the preliminary rounds (pilots tied at the cut-off too) fly {flyOffRounds.length} more rounds in one group;
            preliminary points and penalties do not carry over, and once 3 fly-off rounds are complete the fly-off decides the top places (F3K.10).
          </p>
          <ol className="list-decimal pl-5" aria-label="Fly-off rounds">
            {flyOffRounds.map((r) => (
              <li key={r.id}>Task {r.task.letter}: {r.task.name}
                {officer && flyOffPilots.length > 0 && <> · <Link className="inline-flex min-h-12 items-center underline" href={`/contests/${contestId}/rounds/fly-off-${r.number}`}>Timekeepers for fly-off round {r.number}</Link> · <Link className="inline-flex min-h-12 items-center underline" href={`/contests/${contestId}/rounds/fly-off-${r.number}/cards`}>Paper cards for fly-off round {r.number}</Link></>}
              </li>
            ))}
          </ol>
          {flyOffPilots.length === 0
            ? <p className="text-muted">Not drawn yet: the officer draws the fly-off once every preliminary round is scored.</p>
            : <p><span className="font-semibold">Fly-off pilots ({flyOffPilots.length}):</span> {flyOffPilots.map((id) => names.get(id) ?? "?").sort().join(", ")}</p>}
          {officer && <DrawFlyOff contestId={contestId} drawn={flyOffPilots.length > 0} />}
        </section>
      )}
      {officer && contest.drawSeed !== null && <ContestDisputes contestId={contestId} zone={zone} disputes={disputes} />}
    </div>
  );
}
