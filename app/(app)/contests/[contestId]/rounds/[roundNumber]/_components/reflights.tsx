"use client";
import { useState } from "react";
import { useSend } from "@/components/request/use-send";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/form-footer";
import type { LinkableLane } from "@/lib/contests/linkable";
import { paperCardResult, readTimes } from "@/lib/contests/paper-card";
import { REFLIGHT_CAUSES, REFLIGHT_PLACEMENTS, type ReflightCause, type ReflightPlacement } from "@/lib/events/schema";
import { REFLIGHT_CAUSE_WORDS, REFLIGHT_PLACEMENT_WORDS } from "@/lib/field/ruling-words";
import { formatClock } from "@/lib/format";
import { LinkedRunSelect } from "@/components/contests/linked-run-select";
import { formatTenths, type TaskDefinition } from "@/lib/tasks";
import { ReflightTimekeeper } from "./reflight-timekeeper";

export type ReflightRow = {
  entryId: string; name: string; cause: ReflightCause; placement: ReflightPlacement; entitled: boolean; groupNumber: number; reason: string | null;
  grantedBy: string | null; grantedAt: string; paperFlights: number[] | null; runId: string | null; lane: number | null;
  runResultTenths: number | null; recordedAt: string | null; signed: boolean; signedFrom: string | null;
  timekeeperUserId: string | null; timekeeperName: string | null; timekeeperAssignedAt: string | null;
};

const field = "mt-1 block min-h-12 w-full rounded-lg border border-line bg-raised p-2";

/**
 * The round's re-flights (F3K.9.6, F3K.4.2): the officer grants one (why, where it is flown, who
 * and when are kept), then records its result from a paper card or a timed run, with its signature.
 * Which result stands follows the placement (lib/scoring/reflight.ts), shown beside each.
 */
export function Reflights(p: {
  contestId: string; roundKey: string; timeZone: string; task: TaskDefinition; pilots: { entryId: string; name: string; groupNumber: number }[];
  groups: number[]; reflights: ReflightRow[]; lanes: LinkableLane[];
  /** Who may keep time, and each group's flying accounts (a re-flight's timekeeper must not fly in its group). */
  candidates: { id: string; name: string }[]; flyingByGroup: Record<number, string[]>;
}) {
  const { send, busy, error } = useSend();
  const granted = new Set(p.reflights.map((r) => r.entryId));
  const offered = p.pilots.filter((x) => !granted.has(x.entryId));
  const [entryId, setEntryId] = useState("");
  const [cause, setCause] = useState<ReflightCause>("organiser");
  const [placement, setPlacement] = useState<ReflightPlacement>("later-group");
  const [group, setGroup] = useState("");
  const [entitled, setEntitled] = useState(true);
  const [reason, setReason] = useState("");
  const own = p.pilots.find((x) => x.entryId === entryId)?.groupNumber ?? null;
  async function grant() {
    const groupNumber = placement === "original-group" ? (own ?? 1) : Number(group);
    const reply = await send("POST", `/api/contests/${p.contestId}/rounds/${p.roundKey}/reflights`, { entryId, cause, placement, entitled, groupNumber, reason });
    if (reply?.ok) { setEntryId(""); setReason(""); setGroup(""); }
  }
  return (
    <section aria-labelledby="reflights-title" className="space-y-4 rounded-xl border-2 border-line p-3">
      <h2 id="reflights-title" className="text-xl font-bold">Re-flights</h2>
      <p className="text-sm text-muted">
        F3K.9.6: a re-flight is flown in a later group (the better of the two results stands), else in a new group of at least 4 re-flyers
        filled by draw, else with the original group at the end of the round (in these two the re-flight&apos;s result stands even if worse;
        group mates flying again keep the better of their two). F3K.4.2: a collision during a model&apos;s launch gives a re-flight.
      </p>
      {p.reflights.length === 0 && <p className="text-muted">No re-flights in this round.</p>}
      <ul className="space-y-3">
        {p.reflights.map((r) => <ReflightItem key={r.entryId} {...p} r={r} />)}
      </ul>
      {offered.length > 0 && (
        <form aria-label="Grant a re-flight" className="space-y-2 border-t border-line pt-3" onSubmit={(e) => { e.preventDefault(); void grant(); }}>
          <h3 className="font-bold">Grant a re-flight</h3>
          <label className="block">Pilot
            <select className={field} value={entryId} onChange={(e) => setEntryId(e.target.value)} required>
              <option value="">Choose a pilot</option>
              {offered.map((x) => <option key={x.entryId} value={x.entryId}>{x.name} (group {x.groupNumber})</option>)}
            </select>
          </label>
          <label className="block">Why
            <select className={field} value={cause} onChange={(e) => setCause(e.target.value as ReflightCause)}>
              {REFLIGHT_CAUSES.map((c) => <option key={c} value={c}>{REFLIGHT_CAUSE_WORDS[c]}</option>)}
            </select>
          </label>
          <label className="block">Where it is flown
            <select className={field} value={placement} onChange={(e) => setPlacement(e.target.value as ReflightPlacement)}>
              {REFLIGHT_PLACEMENTS.map((x) => <option key={x} value={x}>{REFLIGHT_PLACEMENT_WORDS[x].label}</option>)}
            </select>
          </label>
          <p className="text-sm">{REFLIGHT_PLACEMENT_WORDS[placement].stands}.</p>
          {placement !== "original-group" && (
            <label className="block">Group it is flown in
              <input className={field} inputMode="numeric" value={group} onChange={(e) => setGroup(e.target.value)} required
                placeholder={placement === "later-group" ? `a group after ${own ?? "the pilot's"}` : `a new group, e.g. ${Math.max(0, ...p.groups) + 1}`} />
            </label>
          )}
          <label className="flex min-h-12 items-center gap-2">
            <input type="checkbox" className="h-6 w-6" checked={!entitled} onChange={(e) => setEntitled(!e.target.checked)} />
            Flies again with the re-flyer, not entitled (keeps the better result)
          </label>
          <label className="block">Note (optional)
            <input className={field} value={reason} maxLength={200} onChange={(e) => setReason(e.target.value)} />
          </label>
          <FormError message={error} />
          <Button type="submit" disabled={busy || entryId === ""}>Grant the re-flight</Button>
        </form>
      )}
    </section>
  );
}

function ReflightItem(p: {
  contestId: string; roundKey: string; timeZone: string; task: TaskDefinition; lanes: LinkableLane[]; r: ReflightRow;
  candidates: { id: string; name: string }[]; flyingByGroup: Record<number, string[]>;
}) {
  const { r } = p;
  const { send, busy, error } = useSend();
  const [times, setTimes] = useState((r.paperFlights ?? []).map((t) => (t / 10).toFixed(1)).join(" "));
  const [link, setLink] = useState(r.runId !== null ? `${r.runId}#${r.lane}` : "");
  const [signed, setSigned] = useState(r.signed);
  const { flights, bad } = readTimes(times);
  async function save() {
    if (bad !== null) return;
    const [runId, lane] = link === "" ? [null, null] : [link.split("#")[0]!, Number(link.split("#")[1])];
    await send("PUT", `/api/contests/${p.contestId}/rounds/${p.roundKey}/reflights`, {
      entryId: r.entryId, flights: runId === null && flights.length > 0 ? flights : null, runId, lane, signed,
    });
  }
  const result = link !== "" ? (link === `${r.runId}#${r.lane}` ? r.runResultTenths : p.lanes.find((l) => `${l.runId}#${l.lane}` === link)?.resultTenths ?? null)
    : flights.length > 0 && bad === null ? paperCardResult(p.task, flights).tenths : null;
  return (
    <li aria-label={`Re-flight, ${r.name}`} className="space-y-2 rounded-lg border border-line p-2">
      <p className="font-semibold">{r.name}: {REFLIGHT_CAUSE_WORDS[r.cause]}, {REFLIGHT_PLACEMENT_WORDS[r.placement].label} (group {r.groupNumber}){r.entitled ? "" : ", flies again with the re-flyer"}</p>
      <p className="text-sm text-muted">Granted by {r.grantedBy ?? "a former officer"} on {formatClock(new Date(r.grantedAt), p.timeZone, "long")}{r.reason ? ` · ${r.reason}` : ""}. {r.entitled ? REFLIGHT_PLACEMENT_WORDS[r.placement].stands : "the better of the two results stands"}.</p>
      <ReflightTimekeeper contestId={p.contestId} roundKey={p.roundKey} timeZone={p.timeZone} entryId={r.entryId} name={r.name} candidates={p.candidates}
        flying={p.flyingByGroup[r.groupNumber] ?? []} timekeeperUserId={r.timekeeperUserId} timekeeperName={r.timekeeperName} assignedAt={r.timekeeperAssignedAt} />
      {r.signedFrom && <p className="text-sm">Signed {r.signedFrom}.</p>}
      <form aria-label={`Re-flight result, ${r.name}`} className="space-y-2" onSubmit={(e) => { e.preventDefault(); void save(); }}>
        <label className="block">Re-flight times of {r.name}
          <input className={`${field} figures`} inputMode="decimal" autoComplete="off" value={times} disabled={link !== ""} onChange={(e) => setTimes(e.target.value)} />
        </label>
        {(p.lanes.length > 0 || r.runId) && (
          <LinkedRunSelect label={`Timed run of ${r.name}'s re-flight`} lanes={p.lanes} linked={r.runId !== null && r.lane !== null ? { runId: r.runId, lane: r.lane } : null}
            value={link} onChange={setLink} timeZone={p.timeZone} className={field} />
        )}
        {bad !== null ? <p className="text-sm font-bold text-danger">&quot;{bad}&quot; is not a flight time.</p>
          : <p className="text-sm">{result === null ? "Not flown yet: the first result stands meanwhile." : `Re-flight result ${formatTenths(result)}`}</p>}
        <label className="flex min-h-12 items-center gap-2">
          <input type="checkbox" className="h-6 w-6" checked={signed} onChange={(e) => setSigned(e.target.checked)} />
          Re-flight signed ({r.name})
        </label>
        <FormError message={error} />
        <Button type="submit" disabled={busy || bad !== null}>Save {r.name}&apos;s re-flight</Button>
      </form>
    </li>
  );
}
