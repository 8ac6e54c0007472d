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

const Alert = ({ message }: { message: string | null }) => (message ? <p role="alert" className="text-danger">{message}</p> : null);

/** A pilot enters, ticking up to five models of their hangar (F3K.2.3). */
export function EnterForm({ contestId, models, fee }: { contestId: string; models: { id: string; name: string }[]; fee: string | null }) {
  const { message, run } = useAction();
  const [picked, setPicked] = useState<string[]>([]);
  return (
    <form className="space-y-2" onSubmit={(e) => { e.preventDefault(); void run("POST", `/api/contests/${contestId}/entries`, { modelIds: picked }); }}>
      <fieldset><legend className="font-bold">Your models (up to five)</legend>
        {models.length === 0 && <p className="text-muted">Your hangar is empty; you can enter without models.</p>}
        {models.map((m) => (
          <label key={m.id} className="flex items-center gap-2">
            <input type="checkbox" checked={picked.includes(m.id)} disabled={!picked.includes(m.id) && picked.length >= 5}
              onChange={(e) => setPicked(e.target.checked ? [...picked, m.id] : picked.filter((x) => x !== m.id))} />{m.name}
          </label>
        ))}
      </fieldset>
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
  return (
    <form className="space-y-2" onSubmit={(e) => {
      e.preventDefault();
      void run("POST", `/api/contests/${contestId}/paper-entries`, { pilotName, keepApart }).then(() => { setPilotName(""); setKeepApart(""); });
    }}>
      <label className="block">Pilot&apos;s name<input className="mt-1 block w-full rounded-lg border border-line bg-raised p-2" value={pilotName} onChange={(e) => setPilotName(e.target.value)} required /></label>
      <label className="block">Keep apart from entries with the word (shared timekeeper, helper, family)
        <input className="mt-1 block w-full rounded-lg border border-line bg-raised p-2" value={keepApart} onChange={(e) => setKeepApart(e.target.value)} />
      </label>
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
