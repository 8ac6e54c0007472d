"use client";
import { useState, type FormEvent } from "react";
import { useSend } from "@/components/request/use-send";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/form-footer";

type Slot = { roundNumber: number; groupNumber: number; entryId: string };
const select = "mt-1 block min-h-touch w-full rounded-lg border-2 border-line bg-raised px-3 text-ink";

/** Sends one change of the draw; the server's refusal shows under the form, a success reloads the lists. */
function useChange(url: string) {
  const request = useSend();
  const [done, setDone] = useState<string | null>(null);
  async function send(body: unknown) {
    setDone(null);
    const reply = await request.send<{ summary: string }>("POST", url, body);
    if (reply?.ok) setDone(reply.data.summary);
  }
  return { message: request.error, done, busy: request.busy, send };
}

/**
 * The officer's changes to a made draw, also after it is locked: two pilots of a round trade
 * groups, or the rounds not flown yet are drawn again for today's entries (a withdrawal, a late
 * entry). Rounds with results stay as they are; the server says so when asked.
 */
export function DrawChanges({ contestId, slots, names, rounds }: { contestId: string; slots: Slot[]; names: Record<string, string>; rounds: number[] }) {
  const [round, setRound] = useState(rounds[0] ?? 1);
  const inRound = slots.filter((s) => s.roundNumber === round).sort((x, y) => (names[x.entryId] ?? "").localeCompare(names[y.entryId] ?? ""));
  const [a, setA] = useState("");
  const [b, setB] = useState("");
  const swap = useChange(`/api/contests/${contestId}/draw/swap`);
  const [fromRound, setFromRound] = useState(rounds[rounds.length - 1] ?? 1);
  const redraw = useChange(`/api/contests/${contestId}/draw/redraw`);
  const option = (s: Slot) => <option key={s.entryId} value={s.entryId}>{names[s.entryId] ?? "?"} (group {s.groupNumber})</option>;

  function onSwap(e: FormEvent) {
    e.preventDefault();
    void swap.send({ round, a, b });
  }
  function onRedraw(e: FormEvent) {
    e.preventDefault();
    void redraw.send({ fromRound });
  }
  return (
    <div className="space-y-6">
      <form onSubmit={onSwap} aria-labelledby="swap-title" className="space-y-2 rounded-xl border border-line p-3">
        <h3 id="swap-title" className="font-bold">Swap two pilots</h3>
        <label className="block">Round
          <select className={select} value={round} onChange={(e) => { setRound(Number(e.target.value)); setA(""); setB(""); }}>
            {rounds.map((r) => <option key={r} value={r}>Round {r}</option>)}
          </select>
        </label>
        <label className="block">First pilot
          <select className={select} value={a} onChange={(e) => setA(e.target.value)} required>
            <option value="">Choose…</option>
            {inRound.map(option)}
          </select>
        </label>
        <label className="block">Second pilot
          <select className={select} value={b} onChange={(e) => setB(e.target.value)} required>
            <option value="">Choose…</option>
            {inRound.filter((s) => s.entryId !== a).map(option)}
          </select>
        </label>
        <FormError message={swap.message} />
        {swap.done && <p role="status">{swap.done}</p>}
        <Button type="submit" disabled={swap.busy}>{swap.busy ? "Swapping…" : "Swap their groups"}</Button>
      </form>
      <form onSubmit={onRedraw} aria-labelledby="redraw-title" className="space-y-2 rounded-xl border border-line p-3">
        <h3 id="redraw-title" className="font-bold">Draw the remaining rounds again</h3>
        <p className="text-sm text-muted">For the pilots entered now. Earlier rounds stay; who already met there counts, so the new groups spread meetings over the whole contest.</p>
        <label className="block">From round
          <select className={select} value={fromRound} onChange={(e) => setFromRound(Number(e.target.value))}>
            {rounds.map((r) => <option key={r} value={r}>Round {r}</option>)}
          </select>
        </label>
        <FormError message={redraw.message} />
        {redraw.done && <p role="status">{redraw.done}</p>}
        <Button type="submit" variant="secondary" disabled={redraw.busy}>{redraw.busy ? "Drawing…" : "Draw them again"}</Button>
      </form>
    </div>
  );
}
