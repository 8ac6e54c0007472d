"use client";

import { useEffect, useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { changeEmailSchema } from "@/lib/validations/email";
import { accountRequest, fieldErrors } from "./account-request";

type State = { email: string; verified: boolean } | "loading" | "offline";
type Errors = Partial<Record<"newEmail" | "currentPassword" | "form", string>>;

/**
 * The account's address: whether it is verified (with "resend" when not — the account works either
 * way, a pilot at a field without signal is never held up by it), and a change of address, which
 * happens only when the link mailed to the new address is followed.
 */
export function EmailSettings() {
  const [state, setState] = useState<State>("loading");
  const [note, setNote] = useState<string | null>(null);
  const [errors, setErrors] = useState<Errors>({});
  const [busy, setBusy] = useState(false);

  useEffect(() => {
    fetch("/api/account/email", { cache: "no-store" })
      .then((r) => (r.ok ? r.json() : "offline"))
      .then((s: State) => setState(s))
      .catch(() => setState("offline"));
  }, []);

  async function resend() {
    const reply = await accountRequest("/api/account/verification", "POST", {});
    setNote(reply.ok ? "Sent. Check your e-mail for the link." : (reply.message ?? "Could not send."));
  }

  async function onChange(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = e.currentTarget;
    const data = new FormData(form);
    const parsed = changeEmailSchema.safeParse({ newEmail: data.get("newEmail"), currentPassword: data.get("currentPassword") });
    if (!parsed.success) return setErrors(fieldErrors(parsed.error.issues));
    setBusy(true);
    setErrors({});
    const reply = await accountRequest("/api/account/email", "POST", parsed.data);
    setBusy(false);
    if (!reply.ok) {
      if (reply.code === "wrong_password") return setErrors({ currentPassword: reply.message });
      const byField = fieldErrors<keyof Errors>(reply.issues ?? []);
      return setErrors(Object.keys(byField).length ? byField : { form: reply.message });
    }
    form.reset();
    setNote(`We have sent a link to ${parsed.data.newEmail}. Your address changes when you follow it.`);
  }

  if (state === "loading") return <p className="text-muted">Loading your e-mail address…</p>;
  if (state === "offline") return <p className="text-muted">Your e-mail address can be managed with a connection.</p>;
  return (
    <div className="space-y-3">
      <h3 className="font-bold">E-mail address</h3>
      <p>
        {state.email} —{" "}
        {state.verified ? (
          <span className="font-semibold">verified</span>
        ) : (
          <>
            <span className="font-semibold text-danger">not verified</span>{" "}
            <Button type="button" variant="secondary" onClick={resend}>
              Resend the link
            </Button>
          </>
        )}
      </p>
      <p role="status" aria-live="polite" className="font-semibold empty:hidden">
        {note}
      </p>
      <form onSubmit={onChange} className="space-y-3" noValidate aria-label="Change e-mail address">
        <TextField id="new-email" name="newEmail" type="email" label="New e-mail address" autoComplete="email" required error={errors.newEmail} />
        <TextField id="email-current-password" name="currentPassword" type="password" label="Your password, to change the address" autoComplete="current-password" required error={errors.currentPassword} />
        <p role="alert" className="font-semibold text-danger empty:hidden">
          {errors.form}
        </p>
        <Button type="submit" variant="secondary" disabled={busy}>
          {busy ? "Sending…" : "Change e-mail address"}
        </Button>
      </form>
    </div>
  );
}
