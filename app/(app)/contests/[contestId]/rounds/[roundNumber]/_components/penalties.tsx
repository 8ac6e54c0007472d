"use client";
import { useState } from "react";
import { useSend } from "@/components/request/use-send";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/form-footer";
import { fixedPenaltyPoints, penaltyCauseText, penaltyNotCounted, penaltyWhoWhen, type ContestPenalty } from "@/lib/contests/penalties";
import { PENALTY_CAUSES, type PenaltyCause } from "@/lib/events/schema";
import { PENALTY_CAUSE_WORDS } from "@/lib/field/ruling-words";

const field = "mt-1 block min-h-12 w-full rounded-lg border border-line bg-raised p-2";

/**
 * The round's penalties, one by one (the officers', the timekeepers' phones', the paper cards'), with
 * cause, size, who and when; a removed one struck through with who removed it and when. The officer
 * gives a pilot a penalty (the phone's penalties for that pilot are shown first, so one is not typed
 * twice) and removes an officer's penalty, saying why; a timekeeper's phone's penalty is set aside, saying why
 * (an event in the run: the run's result is worked out again, F3K.4.3 and F3K.4.1 included).
 */
export function Penalties(p: { contestId: string; roundKey: string; timeZone: string; pilots: { entryId: string; name: string; groupNumber: number }[]; penalties: ContestPenalty[] }) {
  const { send, busy, error } = useSend();
  const [entryId, setEntryId] = useState("");
  const [cause, setCause] = useState<PenaltyCause>("object-in-safety-area");
  const [points, setPoints] = useState("");
  const [note, setNote] = useState("");
  const [separate, setSeparate] = useState(false);
  const fixed = fixedPenaltyPoints(cause);
  const phone = p.penalties.filter((x) => x.entryId === entryId && (x.source === "phone" || x.source === "reflight-phone"));
  const url = `/api/contests/${p.contestId}/rounds/${p.roundKey}/penalties`;
  async function give() {
    const reply = await send("POST", url, { entryId, cause, points: fixed ?? Number(points), note, separate });
    if (reply?.ok) { setEntryId(""); setPoints(""); setNote(""); setSeparate(false); }
  }
  return (
    <section aria-labelledby="penalties-title" className="space-y-4 rounded-xl border-2 border-line p-3">
      <h2 id="penalties-title" className="text-xl font-bold">Penalties</h2>
      <p className="text-sm text-muted">
        Each penalty is taken from the pilot&apos;s total and stays even when this round is dropped (F3K.10). Several in one attempt: give only the
        highest (F3K.4.3); none when a mid-air collision caused the contact. Contact with a person at launch makes the round score zero, plus the
        penalty (F3K.4.1). Penalties given on a timekeeper&apos;s phone already count: do not type them again. One given in error is set
        aside here: the run&apos;s result is then worked out again, as if the timekeeper had undone it, and the phones get the decision.
      </p>
      {p.penalties.length === 0 ? <p className="text-muted">No penalties in this round.</p> : (
        <ul aria-label="Penalties of the round" className="space-y-2">
          {p.penalties.map((x, i) => <PenaltyItem key={x.id ?? x.eventId ?? `${x.source}-${i}`} url={url} timeZone={p.timeZone} x={x} />)}
        </ul>
      )}
      <form aria-label="Give a penalty" className="space-y-2 border-t border-line pt-3" onSubmit={(e) => { e.preventDefault(); void give(); }}>
        <h3 className="font-bold">Give a penalty</h3>
        <label className="block">Pilot
          <select className={field} value={entryId} onChange={(e) => setEntryId(e.target.value)} required>
            <option value="">Choose a pilot</option>
            {p.pilots.map((x) => <option key={x.entryId} value={x.entryId}>{x.name} (group {x.groupNumber})</option>)}
          </select>
        </label>
        {entryId !== "" && (
          <p className="text-sm" aria-label="The phone's penalties for this pilot">
            {phone.length === 0 ? "No penalty from a timekeeper's phone for this pilot in this round." :
              `From the timekeeper's phone already: ${phone.map((x) => `−${x.points} ${penaltyCauseText(x.cause)}${x.applied ? "" : " (not counted)"}`).join("; ")}.`}
          </p>
        )}
        <label className="block">For
          <select className={field} value={cause} onChange={(e) => setCause(e.target.value as PenaltyCause)}>
            {PENALTY_CAUSES.map((c) => <option key={c} value={c}>{PENALTY_CAUSE_WORDS[c].label}{PENALTY_CAUSE_WORDS[c].points ? ` (−${PENALTY_CAUSE_WORDS[c].points})` : ""}</option>)}
          </select>
        </label>
        {fixed === null && (
          <label className="block">Points
            <input className={field} type="number" inputMode="numeric" min={0} max={1000} value={points} required onChange={(e) => setPoints(e.target.value)} />
          </label>
        )}
        <label className="block">Note (optional)
          <input className={field} value={note} maxLength={200} onChange={(e) => setNote(e.target.value)} />
        </label>
        {phone.some((x) => x.cause === cause && x.applied) && (
          <label className="flex min-h-12 items-center gap-2">
            <input type="checkbox" className="h-6 w-6" checked={separate} onChange={(e) => setSeparate(e.target.checked)} />
            Another penalty than the phone&apos;s (a different attempt)
          </label>
        )}
        <FormError message={error} />
        <Button type="submit" disabled={busy || entryId === "" || (fixed === null && points === "")}>Give the penalty</Button>
      </form>
    </section>
  );
}

function PenaltyItem(p: { url: string; timeZone: string; x: ContestPenalty }) {
  const { x } = p;
  const { send, busy, error } = useSend();
  const [reason, setReason] = useState("");
  const removed = x.removedAtMs !== null;
  const notCounted = penaltyNotCounted(x);
  return (
    <li aria-label={`Penalty, ${x.name}`} className="space-y-1 rounded-lg border border-line p-2">
      <p>
        <span className={removed ? "line-through" : "font-semibold"}>{x.name}: −{x.points}{x.cause ? `, ${penaltyCauseText(x.cause)}` : ""}{x.reason ? ` "${x.reason}"` : ""}</span>
        {notCounted && <span className="font-bold"> — not counted ({notCounted})</span>}
      </p>
      <p className="text-sm text-muted">{penaltyWhoWhen(x, p.timeZone)}</p>
      {x.source === "officer" && !removed && (
        <form aria-label={`Remove the penalty, ${x.name}`} className="flex flex-wrap items-end gap-2" onSubmit={(e) => { e.preventDefault(); void send("DELETE", p.url, { penaltyId: x.id, reason }); }}>
          <label className="block grow">Why it is removed
            <input className={field} value={reason} maxLength={200} required onChange={(e) => setReason(e.target.value)} />
          </label>
          <Button type="submit" disabled={busy || reason.trim() === ""}>Remove</Button>
          <FormError message={error} />
        </form>
      )}
      {x.eventId !== null && !removed && (
        <form aria-label={`Set aside the phone's penalty, ${x.name}`} className="flex flex-wrap items-end gap-2"
          onSubmit={(e) => { e.preventDefault(); void send("POST", `${p.url}/phone-set-aside`, { eventId: x.eventId, reason }); }}>
          <label className="block grow">Why it is set aside
            <input className={field} value={reason} maxLength={200} required onChange={(e) => setReason(e.target.value)} />
          </label>
          <Button type="submit" disabled={busy || reason.trim() === ""}>Set aside</Button>
          <FormError message={error} />
        </form>
      )}
    </li>
  );
}
