"use client";

import { useMemo, useState } from "react";
import { FormFooter } from "@/components/ui/form-footer";
import { useSend } from "@/components/request/use-send";

/** The IANA names this browser's Intl knows, with UTC first (the default of every club). */
function zoneNames(current: string): string[] {
  const known = typeof Intl.supportedValuesOf === "function" ? Intl.supportedValuesOf("timeZone") : [];
  return [...new Set(["UTC", current, ...known])];
}

/** An officer sets the club's time zone: a field day is a date on the club's clock. The server checks the name with Intl. */
export function TimeZoneForm({ slug, timeZone }: { slug: string; timeZone: string }) {
  const { send, busy, error } = useSend();
  const [value, setValue] = useState(timeZone);
  const names = useMemo(() => zoneNames(timeZone), [timeZone]);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    await send("PUT", `/api/clubs/${slug}/time-zone`, { timeZone: value });
  }

  return (
    <form onSubmit={(e) => void submit(e)} className="space-y-3" noValidate aria-label="The club's time zone">
      <div className="space-y-1">
        <label htmlFor="club-time-zone" className="block font-semibold">
          Time zone
        </label>
        <select id="club-time-zone" value={value} onChange={(e) => setValue(e.target.value)} className="min-h-12 w-full rounded-lg border-2 border-line bg-raised px-2">
          {names.map((n) => (
            <option key={n} value={n}>
              {n}
            </option>
          ))}
        </select>
      </div>
      <FormFooter error={error} submitting={busy} label="Save the time zone" busyLabel="Saving…" />
    </form>
  );
}
