"use client";
import { useState } from "react";
import { useSend } from "@/components/request/use-send";
import { Button } from "@/components/ui/button";

function useAction() {
  const { send, error } = useSend();
  async function run(method: "POST" | "DELETE", url: string, body?: unknown) {
    const reply = await send<{ checkoutUrl?: string | null }>(method, url, body);
    // an entry with a fee goes on to the payments service's page, and comes back here
    if (reply?.ok && reply.data?.checkoutUrl) window.location.assign(reply.data.checkoutUrl);
  }
  return { message: error, run };
}

const JuniorBox = ({ checked, onChange, label }: { checked: boolean; onChange: (v: boolean) => void; label: string }) => (
  <label className="flex min-h-12 items-center gap-2"><input type="checkbox" className="size-6" checked={checked} onChange={(e) => onChange(e.target.checked)} />{label} (also ranked among the juniors)</label>
);

const Alert = ({ message }: { message: string | null }) => (message ? <p role="alert" className="text-danger">{message}</p> : null);

/** A pilot enters, ticking up to five models of their hangar (F3K.2.3). */
export function EnterForm({ contestId, models, fee }: { contestId: string; models: { id: string; name: string }[]; fee: string | null }) {
  const { message, run } = useAction();
  const [picked, setPicked] = useState<string[]>([]);
  const [junior, setJunior] = useState(false);
  return (
    <form className="space-y-2" onSubmit={(e) => { e.preventDefault(); void run("POST", `/api/contests/${contestId}/entries`, { modelIds: picked, pilotClass: junior ? "junior" : "senior" }); }}>
      <fieldset><legend className="font-bold">Your models (up to five)</legend>
        {models.length === 0 && <p className="text-muted">Your hangar is empty; you can enter without models.</p>}
        {models.map((m) => (
          <label key={m.id} className="flex items-center gap-2">
            <input type="checkbox" checked={picked.includes(m.id)} disabled={!picked.includes(m.id) && picked.length >= 5}
              onChange={(e) => setPicked(e.target.checked ? [...picked, m.id] : picked.filter((x) => x !== m.id))} />{m.name}
          </label>
        ))}
      </fieldset>
      <JuniorBox checked={junior} onChange={setJunior} label="I fly as a junior" />
      <Alert message={message} />
      {fee && <p>The entry fee is {fee}, paid by card on the next page (or in cash to the officer).</p>}
      <Button type="submit">{fee ? "Enter and pay" : "Enter this contest"}</Button>
    </form>
  );
}

/** The officer types in an entry from paper. */
export function PaperEntryForm({ contestId }: { contestId: string }) {
  const { message, run } = useAction();
  const [pilotName, setPilotName] = useState("");
  const [keepApart, setKeepApart] = useState("");
  const [junior, setJunior] = useState(false);
  return (
    <form className="space-y-2" onSubmit={(e) => {
      e.preventDefault();
      void run("POST", `/api/contests/${contestId}/paper-entries`, { pilotName, keepApart, pilotClass: junior ? "junior" : "senior" }).then(() => { setPilotName(""); setKeepApart(""); setJunior(false); });
    }}>
      <label className="block">Pilot&apos;s name<input className="mt-1 block w-full rounded-lg border border-line bg-raised p-2" value={pilotName} onChange={(e) => setPilotName(e.target.value)} required /></label>
      <label className="block">Keep apart from entries with the word (shared timekeeper, helper, family)
        <input className="mt-1 block w-full rounded-lg border border-line bg-raised p-2" value={keepApart} onChange={(e) => setKeepApart(e.target.value)} />
      </label>
      <JuniorBox checked={junior} onChange={setJunior} label="A junior" />
      <Alert message={message} />
      <Button type="submit">Add the paper entry</Button>
    </form>
  );
}

export function ActionButton({ label, method, url, body }: { label: string; method: "POST" | "DELETE"; url: string; body?: unknown }) {
  const { message, run } = useAction();
  return (
    <span>
      <button type="button" className="underline" onClick={() => void run(method, url, body)}>{label}</button>
      <Alert message={message} />
    </span>
  );
}

/** The officer's team and class of one entry, saved together. */
export function EntryDetails({ contestId, entryId, pilotName, team, pilotClass }: { contestId: string; entryId: string; pilotName: string; team: string | null; pilotClass: "senior" | "junior" }) {
  const { send, busy, error } = useSend();
  const [teamName, setTeamName] = useState(team ?? "");
  const [klass, setKlass] = useState(pilotClass);
  return (
    <form className="flex flex-wrap items-end gap-2" aria-label={`Team and class of ${pilotName}`}
      onSubmit={(e) => { e.preventDefault(); void send("PATCH", `/api/contests/${contestId}/entries/${entryId}`, { team: teamName, pilotClass: klass }); }}>
      <label className="block text-sm">Team of {pilotName}
        <input className="mt-1 block min-h-12 rounded-lg border border-line bg-raised px-2" value={teamName} maxLength={40} onChange={(e) => setTeamName(e.target.value)} />
      </label>
      {/* label by id, not around the select: a wrapping label's name would take in the options' words */}
      <span className="block text-sm">
        <label htmlFor={`class-${entryId}`}>Class of {pilotName}</label>
        <select id={`class-${entryId}`} className="mt-1 block min-h-12 rounded-lg border border-line bg-raised px-2" value={klass} onChange={(e) => setKlass(e.target.value as "senior" | "junior")}>
          <option value="senior">Senior</option><option value="junior">Junior</option>
        </select>
      </span>
      <Button type="submit" variant="secondary" disabled={busy}>Save</Button>
      <Alert message={error} />
    </form>
  );
}
