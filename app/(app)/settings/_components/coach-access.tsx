"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useEffect, useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { coachKeys, type PilotGrantRow } from "@/app/(app)/coach/_components/coach-api";
import { requestJson } from "@/components/request/json";
import { dayText } from "@/app/(app)/season/_components/season-format";
import { DataAge } from "@/app/(app)/season/_components/data-age";
import { getMeta, getWindowcallDb, setMeta } from "@/lib/offline/db";

function describe(g: PilotGrantRow): string {
  if (g.kind === "grant") return `${g.coachName} (${g.coachEmail}) sees your season, runs and flights since ${dayText(g.createdAt)}.`;
  if (g.kind === "email") return `Offered to ${g.email}: waiting for that coach to open the Coach desk (until ${dayText(g.expiresAt)}).`;
  return `A one-time code made ${dayText(g.createdAt)}: waiting to be entered (until ${dayText(g.expiresAt)}).`;
}

/**
 * Who can see the pilot's season: each coach holding a grant and each offer not yet taken up, each
 * revocable at once; and the two ways to offer it (a coach's e-mail, or a one-time code). The reply
 * to an e-mail offer is the same whether or not the address has an account.
 * Settings opens offline (a precached page with no server data), so each fetched list is kept in the
 * account's device database (meta "coachGrants") with its time; offline the kept list is shown with
 * its age (DataAge), as the Season and the coach desk show theirs.
 */
export function CoachAccess() {
  const client = useQueryClient();
  const grants = useQuery({
    queryKey: coachKeys.grants,
    queryFn: async () => {
      const fetched = await requestJson<{ grants: PilotGrantRow[] }>("GET", "/api/coach-grants");
      await setMeta(getWindowcallDb(), "coachGrants", { grants: fetched.grants, fetchedAtMs: Date.now() }).catch(() => undefined);
      return fetched;
    },
  });
  // the list last fetched on this phone, until (or unless) a fresh one arrives
  useEffect(() => {
    let live = true;
    void getMeta(getWindowcallDb(), "coachGrants").then((kept) => {
      if (!live || !kept || client.getQueryData(coachKeys.grants)) return;
      client.setQueryData(coachKeys.grants, { grants: kept.grants }, { updatedAt: kept.fetchedAtMs });
    }).catch(() => undefined);
    return () => { live = false; };
  }, [client]);
  const [email, setEmail] = useState("");
  const [note, setNote] = useState<string | null>(null);
  const refresh = () => client.invalidateQueries({ queryKey: coachKeys.grants });
  const offer = useMutation({
    mutationFn: (body: { kind: "email"; email: string } | { kind: "code" }) =>
      requestJson<{ offer: { kind: string; code?: string; email?: string } }>("POST", "/api/coach-grants", body),
    onSuccess: ({ offer: o }) => {
      setNote(o.code ? `Give your coach this code: ${o.code}. It works once, within a day.` : `Offered to ${o.email}. They get access when they open the Coach desk signed in with that address.`);
      setEmail("");
      return refresh();
    },
  });
  const revoke = useMutation({
    mutationFn: (id: string) => requestJson<void>("DELETE", `/api/coach-grants/${id}`),
    onSuccess: () => { setNote("Revoked. That coach no longer sees your records."); return refresh(); },
  });

  function submit(e: FormEvent) {
    e.preventDefault();
    setNote(null);
    offer.mutate({ kind: "email", email });
  }

  const error = (offer.error ?? revoke.error)?.message;
  return (
    <div className="space-y-3">
      {grants.isPending && grants.fetchStatus === "fetching" ? <p className="text-muted">Loading who can see your season…</p> : null}
      <DataAge query={grants} what="list of coaches" />
      {grants.data ? (
        grants.data.grants.length === 0 ? (
          <p>Only you see your season.</p>
        ) : (
          <ul className="space-y-2" aria-label="Who can see your season">
            {grants.data.grants.map((g) => (
              <li key={g.id} className="flex flex-wrap items-center gap-2">
                <span className="flex-1">{describe(g)}</span>
                <Button type="button" variant="secondary" disabled={revoke.isPending} onClick={() => revoke.mutate(g.id)}>
                  {g.kind === "grant" ? `Revoke ${g.coachName}` : "Withdraw offer"}
                </Button>
              </li>
            ))}
          </ul>
        )
      ) : null}
      <form onSubmit={submit} className="space-y-2" noValidate>
        <TextField id="coach-email" label="Coach's e-mail" type="email" autoComplete="off" value={email} onChange={(e) => setEmail(e.target.value)} />
        <div className="flex flex-wrap gap-2">
          <Button type="submit" disabled={offer.isPending || !email.trim()}>Offer my season</Button>
          <Button type="button" variant="secondary" disabled={offer.isPending} onClick={() => { setNote(null); offer.mutate({ kind: "code" }); }}>
            Make a one-time code
          </Button>
        </div>
      </form>
      <p role="status" aria-live="polite">{error ?? note ?? ""}</p>
    </div>
  );
}
