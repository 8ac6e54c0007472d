"use client";
import { useState } from "react";
import { useSend } from "@/components/request/use-send";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/form-footer";

export type KeeperPilot = {
  entryId: string; name: string; pilotUserId: string | null;
  timekeeperUserId: string | null; timekeeperName: string | null; assignedByName: string | null; assignedAt: string | null;
};

/**
 * One group's timekeepers: per pilot a timekeeper from the club's members and the entered pilots
 * (those flying in this group are not offered; the server refuses them too), saved together.
 */
export function GroupTimekeepersForm(p: { contestId: string; /** The round's URL segment (lib/contests/round-key.ts). */ roundKey: string; groupNumber: number; pilots: KeeperPilot[]; candidates: { id: string; name: string }[] }) {
  const { send, busy, error: message } = useSend();
  const [chosen, setChosen] = useState<Record<string, string>>(() => Object.fromEntries(p.pilots.map((x) => [x.entryId, x.timekeeperUserId ?? ""])));
  const [saved, setSaved] = useState(false);
  const flying = new Set(p.pilots.flatMap((x) => (x.pilotUserId ? [x.pilotUserId] : [])));
  const offered = p.candidates.filter((c) => !flying.has(c.id));
  async function save() {
    const timekeepers = p.pilots.map((x) => ({ entryId: x.entryId, timekeeperUserId: chosen[x.entryId] || null }));
    const reply = await send("PUT", `/api/contests/${p.contestId}/rounds/${p.roundKey}/timekeepers`, { groupNumber: p.groupNumber, timekeepers });
    if (reply?.ok) setSaved(true);
  }
  return (
    <section aria-label={`Group ${p.groupNumber} timekeepers`} className="space-y-3 rounded-xl border-2 border-line p-3">
      <h2 className="text-lg font-bold">Group {p.groupNumber}</h2>
      <ul className="space-y-3">
        {p.pilots.map((x) => (
          <li key={x.entryId} className="space-y-1">
            <label className="flex flex-wrap items-center gap-2">
              <span className="min-w-32 font-semibold">{x.name}</span>
              <select aria-label={`Timekeeper for ${x.name}`} className="min-h-12 rounded-lg border-2 border-line bg-surface px-2"
                value={chosen[x.entryId] ?? ""} onChange={(e) => { setSaved(false); setChosen((c) => ({ ...c, [x.entryId]: e.target.value })); }}>
                <option value="">No timekeeper</option>
                {offered.map((c) => <option key={c.id} value={c.id}>{c.name}</option>)}
              </select>
            </label>
            {x.timekeeperName && x.assignedAt ? (
              <p className="text-sm text-muted">Timed by {x.timekeeperName} · assigned by {x.assignedByName ?? "someone no longer here"} on {new Date(x.assignedAt).toLocaleString()}</p>
            ) : null}
          </li>
        ))}
      </ul>
      <FormError message={message} />
      <div className="flex items-center gap-3">
        <Button type="button" disabled={busy} onClick={() => void save()}>Save group {p.groupNumber}&apos;s timekeepers</Button>
        {saved ? <span role="status">Saved.</span> : null}
      </div>
    </section>
  );
}
