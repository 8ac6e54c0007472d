"use client";

import { useId } from "react";
import { matchMate, MAX_LANES, type ClubMate, type WhoFlies } from "@/lib/field/new-window";

type Props = { who: WhoFlies; onChange: (w: WhoFlies) => void; myName: string; mates: readonly ClubMate[]; error?: string };

const MODES: { mode: WhoFlies["mode"]; title: string; hint: string }[] = [
  { mode: "me", title: "Me, alone", hint: "Practice: you fly and time yourself (a clicker works too)" },
  { mode: "partner", title: "A partner", hint: "You time someone else: a club mate or anyone by name" },
  { mode: "group", title: "Several pilots", hint: `Up to ${MAX_LANES} pilots in one window, one lane each` },
];

/** Who flies in this window: one lane per pilot. */
export function WhoFliesFields({ who, onChange, myName, mates, error }: Props) {
  const names = who.mode === "group" ? who.names : ["", "", "", ""];
  const listId = useId();
  return (
    <fieldset className="space-y-2" aria-describedby={error ? "who-error" : undefined}>
      <legend className="text-lg font-bold">Who flies</legend>
      {MODES.map((m) => (
        <label key={m.mode} className={`flex min-h-touch cursor-pointer gap-3 rounded-xl border-2 p-3 ${who.mode === m.mode ? "border-ink border-4" : "border-line"}`}>
          <input
            type="radio"
            name="who"
            checked={who.mode === m.mode}
            onChange={() => onChange(m.mode === "me" ? { mode: "me" } : m.mode === "partner" ? { mode: "partner", name: "" } : { mode: "group", names: ["", "", "", ""] })}
            className="mt-1 h-5 w-5 shrink-0"
          />
          <span>
            <span className="block font-bold">{m.mode === "me" && myName ? `${m.title} (${myName})` : m.title}</span>
            <span className="block text-sm text-muted">{m.hint}</span>
          </span>
        </label>
      ))}
      {mates.length > 0 ? (
        <datalist id={listId}>
          {mates.map((m) => (
            <option key={m.id} value={m.name} />
          ))}
        </datalist>
      ) : null}
      {who.mode === "partner" ? (
        <NameInput id="partner-name" label="Partner's name" value={who.name} mates={mates} listId={listId} onChange={(name) => onChange({ mode: "partner", name })} />
      ) : null}
      {who.mode === "group"
        ? names.map((n, i) => (
            <NameInput
              key={i}
              id={`pilot-${i + 1}`}
              label={`Pilot in lane ${i + 1}`}
              value={n}
              mates={mates}
              listId={listId}
              onChange={(v) => onChange({ mode: "group", names: names.map((x, j) => (j === i ? v : x)) })}
            />
          ))
        : null}
      {error ? (
        <p id="who-error" className="font-semibold text-danger">
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}

type NameInputProps = { id: string; label: string; value: string; mates: readonly ClubMate[]; listId: string; onChange: (v: string) => void };

/** A pilot's name; a club mate's name (offered as you type) links the lane to their account. */
function NameInput({ id, label, value, mates, listId, onChange }: NameInputProps) {
  const linked = matchMate(value, mates);
  return (
    <div>
      <label htmlFor={id} className="block font-semibold">
        {label}
      </label>
      <input
        id={id}
        value={value}
        maxLength={120}
        autoComplete="off"
        list={mates.length > 0 ? listId : undefined}
        aria-describedby={linked ? `${id}-linked` : undefined}
        onChange={(e) => onChange(e.target.value)}
        className="block min-h-14 w-full rounded-lg border-2 border-line bg-raised px-3 text-lg"
      />
      {linked ? (
        <p id={`${id}-linked`} className="mt-1 text-sm">
          <span aria-hidden>✓ </span>Club mate: the run goes to {linked.name}&rsquo;s logbook too.
        </p>
      ) : null}
    </div>
  );
}
