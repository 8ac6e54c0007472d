"use client";

import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { FormFooter } from "@/components/ui/form-footer";
import { sendJson } from "../../_components/send-json";

/** The IANA names this browser's Intl knows, with UTC first (the default of every club). */
function zoneNames(current: string): string[] {
  const known = typeof Intl.supportedValuesOf === "function" ? Intl.supportedValuesOf("timeZone") : [];
  return [...new Set(["UTC", current, ...known])];
}

/** An officer sets the club's time zone: a field day is a date on the club's clock. The server checks the name with Intl. */
export function TimeZoneForm({ slug, timeZone }: { slug: string; timeZone: string }) {
  const router = useRouter();
  const [value, setValue] = useState(timeZone);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const names = useMemo(() => zoneNames(timeZone), [timeZone]);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setError(null);
    const reply = await sendJson("PUT", `/api/clubs/${slug}/time-zone`, { timeZone: value });
    setBusy(false);
    if (!reply.ok) return setError(reply.message);
    router.refresh();
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
