"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { sendJson } from "@/components/request/json";
import { MAX_FLY_OFF_PILOTS, MIN_FLY_OFF_PILOTS } from "@/lib/contests/fly-off-draw";
import { checkSetup } from "@/lib/contests/setup";
import { FLY_OFF_ROUNDS } from "@/lib/scoring/fly-off";
import { CURRENCIES } from "@/lib/payments/fees";
import { CATALOGUE_EDITION } from "@/lib/tasks/catalogue";
import { HALVES } from "@/lib/validations/contests";

const HALVES_LABEL: Record<(typeof HALVES)[number], string> = { "half-up": "An exact half rounds up", "half-even": "An exact half rounds to even", down: "Cut off (always down)" };

const LETTERS = ["A", "B", "C", "D", "E", "F", "G", "H", "I", "J", "K", "L", "N"];
/** Task M (huge ladder) is flown in fly-offs only (F3K.10, F3K.11.13). */
const FLY_OFF_LETTERS = [...LETTERS.slice(0, 12), "M", "N"];
const input = "mt-1 block w-full rounded-lg border border-line bg-raised p-2";

/** The set-up form: the rules' checks show as you edit (lib/contests/setup.ts); the server checks again. */
export function NewContestForm({ slug, fields }: { slug: string; fields: string[] }) {
  const router = useRouter();
  const [name, setName] = useState("");
  const [startsOn, setStartsOn] = useState("");
  const [fieldName, setFieldName] = useState(fields[0] ?? "");
  const [rounds, setRounds] = useState<string[]>(["A", "B", "D", "F", "G"]);
  const [flyOffRounds, setFlyOffRounds] = useState<string[]>([]);
  const [flyOffPilots, setFlyOffPilots] = useState("");
  const [maxGroupSize, setMaxGroupSize] = useState(10);
  const [prepMinutes, setPrepMinutes] = useState(5);
  const [noFlySeconds, setNoFlySeconds] = useState(60);
  const [dropRule, setDropRule] = useState<"f3k" | "none">("f3k");
  const [practice, setPractice] = useState(false);
  const [halves, setHalves] = useState<(typeof HALVES)[number]>("half-up");
  const [fee, setFee] = useState("");
  const [currency, setCurrency] = useState<string>("eur");
  const [closesAt, setClosesAt] = useState("");
  const [error, setError] = useState<string | null>(null);
  const flyOffCount = flyOffPilots.trim() === "" ? null : Number(flyOffPilots);
  const check = checkSetup({ rounds: [...rounds.map((letter) => ({ letter })), ...flyOffRounds.map((letter) => ({ letter, flyOff: true }))], practice, prepMinutes, noFlySeconds, flyOffPilots: flyOffCount });

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const reply = await sendJson<{ contest: { id: string } }>("POST", `/api/clubs/${slug}/contests`, {
      name, startsOn, fieldName, rounds: rounds.map((letter) => ({ letter })),
      flyOffRounds: flyOffRounds.map((letter) => ({ letter })), flyOffPilots: flyOffCount, maxGroupSize, prepMinutes, noFlySeconds, dropRule, practice, halves, rulesEdition: CATALOGUE_EDITION,
      // the fee in cents; the closing time in this device's time zone, sent as an instant
      entryFeeCents: fee.trim() === "" ? null : Math.round(Number(fee) * 100), currency,
      entriesCloseAt: closesAt === "" || Number.isNaN(new Date(closesAt).getTime()) ? null : new Date(closesAt).toISOString(),
    });
    if (reply.ok) router.push(`/contests/${reply.data.contest.id}`);
    else setError(reply.issues?.map((i) => i.message).join(" ") || reply.message);
  }

  return (
    <form onSubmit={submit} className="space-y-4">
      <label className="block">Name<input className={input} value={name} onChange={(e) => setName(e.target.value)} required /></label>
      <label className="block">Date<input className={input} type="date" value={startsOn} onChange={(e) => setStartsOn(e.target.value)} required /></label>
      <label className="block">Field
        {fields.length > 0 ? (
          <select className={input} value={fieldName} onChange={(e) => setFieldName(e.target.value)}>{fields.map((f) => <option key={f}>{f}</option>)}</select>
        ) : (
          <input className={input} value={fieldName} onChange={(e) => setFieldName(e.target.value)} required />
        )}
      </label>
      <fieldset className="space-y-2">
        <legend className="font-bold">Rounds</legend>
        {rounds.map((letter, i) => (
          <label key={i} className="flex items-center gap-2">Round {i + 1} task
            <select className="rounded-lg border border-line bg-raised p-2" value={letter} onChange={(e) => setRounds(rounds.map((l, j) => (j === i ? e.target.value : l)))}>
              {LETTERS.map((l) => <option key={l}>{l}</option>)}
            </select>
            <button type="button" className="underline" onClick={() => setRounds(rounds.filter((_, j) => j !== i))}>Remove round {i + 1}</button>
          </label>
        ))}
        <button type="button" className="underline" onClick={() => setRounds([...rounds, "N"])}>Add a round</button>
      </fieldset>
      <fieldset className="space-y-2">
        <legend className="font-bold">Fly-off</legend>
        <p className="text-sm text-muted">
          The best pilots of the preliminary rounds fly 3 to 6 more rounds in one group; their preliminary points do not carry over (F3K.10).
          Task M is flown in fly-offs only. Pilots tied at the cut-off fly too. No rounds: no fly-off.
        </p>
        {flyOffRounds.map((letter, i) => (
          <label key={i} className="flex items-center gap-2">Fly-off round {i + 1} task
            <select className="rounded-lg border border-line bg-raised p-2" value={letter} onChange={(e) => setFlyOffRounds(flyOffRounds.map((l, j) => (j === i ? e.target.value : l)))}>
              {FLY_OFF_LETTERS.map((l) => <option key={l}>{l}</option>)}
            </select>
            <button type="button" className="underline" onClick={() => setFlyOffRounds(flyOffRounds.filter((_, j) => j !== i))}>Remove fly-off round {i + 1}</button>
          </label>
        ))}
        {flyOffRounds.length < FLY_OFF_ROUNDS.max && (
          <button type="button" className="underline" onClick={() => setFlyOffRounds(flyOffRounds.length === 0 ? ["M", "A", "B"] : [...flyOffRounds, "A"])}>
            {flyOffRounds.length === 0 ? "Plan a fly-off" : "Add a fly-off round"}
          </button>
        )}
        {flyOffRounds.length > 0 && (
          <label className="block">Pilots in the fly-off
            <input className={input} type="number" inputMode="numeric" min={MIN_FLY_OFF_PILOTS} max={MAX_FLY_OFF_PILOTS} value={flyOffPilots} onChange={(e) => setFlyOffPilots(e.target.value)} required />
          </label>
        )}
      </fieldset>
      <label className="block">Largest group (pilots)<input className={input} type="number" min={5} max={30} value={maxGroupSize} onChange={(e) => setMaxGroupSize(Number(e.target.value))} /></label>
      <label className="block">Preparation time (minutes)<input className={input} type="number" min={1} max={60} value={prepMinutes} onChange={(e) => setPrepMinutes(Number(e.target.value))} /></label>
      <label className="block">No-fly period (seconds)<input className={input} type="number" min={0} max={600} value={noFlySeconds} onChange={(e) => setNoFlySeconds(Number(e.target.value))} /></label>
      <label className="block">Drop rule
        <select className={input} value={dropRule} onChange={(e) => setDropRule(e.target.value as "f3k" | "none")}>
          <option value="f3k">Drop the lowest round from 6 rounds flown (F3K.10)</option>
          <option value="none">Every round counts</option>
        </select>
      </label>
      <label className="block">Points rounding (scores are kept to 0.1 point)
        <select className={input} value={halves} onChange={(e) => setHalves(e.target.value as (typeof HALVES)[number])}>
          {HALVES.map((h) => <option key={h} value={h}>{HALVES_LABEL[h]}</option>)}
        </select>
      </label>
      <p>Rules: {CATALOGUE_EDITION.replace("-", " ")} edition (the one this app implements)</p>
      <fieldset className="space-y-2">
        <legend className="font-bold">Entry fee</legend>
        <label className="block">Entry fee (empty: free)<input className={input} type="number" inputMode="decimal" min={0.5} max={1000} step={0.01} value={fee} onChange={(e) => setFee(e.target.value)} /></label>
        <label className="block">Currency
          <select className={input} value={currency} onChange={(e) => setCurrency(e.target.value)}>{CURRENCIES.map((c) => <option key={c} value={c}>{c.toUpperCase()}</option>)}</select>
        </label>
        <label className="block">Entries close (withdrawals before then are refunded)<input className={input} type="datetime-local" value={closesAt} onChange={(e) => setClosesAt(e.target.value)} /></label>
      </fieldset>
      <label className="flex items-center gap-2"><input type="checkbox" checked={practice} onChange={(e) => setPractice(e.target.checked)} />Practice event (the rules only warn)</label>
      {[...check.errors, ...check.warnings].length > 0 && (
        <ul aria-label="Rule checks" className="list-disc pl-5 text-sm">{[...check.errors, ...check.warnings].map((m) => <li key={m}>{m}</li>)}</ul>
      )}
      {error && <p role="alert" className="text-danger">{error}</p>}
      <Button type="submit" className="w-full">Create the contest</Button>
    </form>
  );
}
