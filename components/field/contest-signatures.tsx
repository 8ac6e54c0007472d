"use client";

import { useState } from "react";
import type { RunLane } from "@/lib/events/entities";
import type { RunEvent } from "@/lib/events/schema";
import { secondsText } from "@/lib/field/display";
import type { PhoneResult } from "@/lib/offline/run-result";
import { applyUndoAndCorrections } from "@/lib/tasks/timeline";

const clock = new Intl.DateTimeFormat("en-GB", { hour: "2-digit", minute: "2-digit" });

/**
 * A contest window after it closed: pilot and timekeeper sign each lane's result here, on the
 * timekeeper's phone (F3K.1.2: an unsigned result scores zero). A signature is a "signed" event of
 * the lane, stored on the phone and synced like every other; the server marks the pilot's contest
 * slot signed with who and when.
 */
export function ContestSignatures({ lanes, events, result, keeperName, onSign }: {
  lanes: readonly RunLane[]; events: readonly RunEvent[]; result: PhoneResult; keeperName: string; onSign: (lane: number) => Promise<unknown> | void;
}) {
  const effective = applyUndoAndCorrections(events.map((e) => ({ id: e.id, atMs: e.stamp.wallMs, body: e.body })));
  return (
    <section aria-labelledby="sign-title" className="space-y-3 rounded-xl border-2 border-line p-3">
      <h2 id="sign-title" className="text-xl font-extrabold">Contest: sign the results</h2>
      <p className="text-sm text-muted">Show each pilot their result. When you both agree, tick both boxes and sign. An unsigned result counts zero (F3K.1.2).</p>
      <ul className="space-y-3">
        {lanes.map((l) => {
          const signed = effective.find((e) => e.body.kind === "signed" && e.body.lane === l.lane);
          const lane = result.folded.lanes[l.lane];
          return (
            <li key={l.lane} aria-label={`Signature, ${l.pilotName}`} className="space-y-2">
              <p className="font-bold">{l.pilotName}: {lane ? `${secondsText(lane.resultTenths)} s` : "nothing timed"}</p>
              {signed ? (
                <p role="status" className="font-semibold">✓ Signed by {l.pilotName} and {keeperName} at {clock.format(new Date(signed.atMs))}</p>
              ) : (
                <SignForm pilot={l.pilotName} keeper={keeperName} onSign={() => onSign(l.lane)} />
              )}
            </li>
          );
        })}
      </ul>
    </section>
  );
}

function SignForm({ pilot, keeper, onSign }: { pilot: string; keeper: string; onSign: () => Promise<unknown> | void }) {
  const [pilotOk, setPilotOk] = useState(false);
  const [keeperOk, setKeeperOk] = useState(false);
  const [busy, setBusy] = useState(false);
  return (
    <div className="space-y-1">
      <label className="flex min-h-12 items-center gap-2"><input type="checkbox" className="size-6" checked={pilotOk} onChange={(e) => setPilotOk(e.target.checked)} />{pilot}: I agree with this result</label>
      <label className="flex min-h-12 items-center gap-2"><input type="checkbox" className="size-6" checked={keeperOk} onChange={(e) => setKeeperOk(e.target.checked)} />{keeper}: I timed it</label>
      <button type="button" disabled={!pilotOk || !keeperOk || busy}
        onClick={async () => { setBusy(true); try { await onSign(); } finally { setBusy(false); } }}
        className="min-h-touch w-full rounded-xl bg-accent font-bold text-accent-ink disabled:opacity-50">
        Sign {pilot}&apos;s result
      </button>
    </div>
  );
}
