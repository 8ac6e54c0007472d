"use client";
import { useState } from "react";
import { useSend } from "@/components/request/use-send";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/form-footer";
import { formatClock } from "@/lib/format";

/**
 * The timekeeper of one granted re-flight: a club member or an entered pilot who does not fly in the
 * group the re-flight is flown in (`flying`: not offered; the server refuses them too). After their next
 * sync the timekeeper's Field screen offers "re-flight, round N, group G — pilot X"; the lane they time
 * becomes the re-flight's result when it syncs back.
 */
export function ReflightTimekeeper(p: {
  contestId: string; roundKey: string; timeZone: string; entryId: string; name: string; candidates: { id: string; name: string }[]; flying: string[];
  timekeeperUserId: string | null; timekeeperName: string | null; assignedAt: string | null;
}) {
  const { send, busy, error } = useSend();
  const [chosen, setChosen] = useState(p.timekeeperUserId ?? "");
  const flying = new Set(p.flying);
  const offered = p.candidates.filter((c) => !flying.has(c.id));
  return (
    <form aria-label={`Re-flight timekeeper, ${p.name}`} className="flex flex-wrap items-end gap-2"
      onSubmit={(e) => { e.preventDefault(); void send("PUT", `/api/contests/${p.contestId}/rounds/${p.roundKey}/reflights/timekeeper`, { entryId: p.entryId, timekeeperUserId: chosen || null }); }}>
      <label className="block">Timekeeper of {p.name}&apos;s re-flight
        <select className="mt-1 block min-h-12 rounded-lg border border-line bg-raised p-2" value={chosen} onChange={(e) => setChosen(e.target.value)}>
          <option value="">No timekeeper (paper card)</option>
          {offered.map((c) => <option key={c.id} value={c.id}>{c.name}</option>)}
        </select>
      </label>
      <Button type="submit" disabled={busy || chosen === (p.timekeeperUserId ?? "")}>Save the timekeeper</Button>
      {p.timekeeperName && p.assignedAt && (
        <p className="w-full text-sm text-muted">Timed on {p.timekeeperName}&apos;s phone (named {formatClock(new Date(p.assignedAt), p.timeZone, "short")}).</p>
      )}
      <FormError message={error} />
    </form>
  );
}
