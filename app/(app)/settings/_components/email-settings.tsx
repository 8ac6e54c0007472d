"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useEffect, useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { changeEmailSchema, type ChangeEmailInput } from "@/lib/validations/email";
import { sendJson } from "@/components/request/json";
import { fieldErrors } from "./account-session";

type State = { email: string; verified: boolean } | "loading" | "offline";

/**
 * The account's address: whether it is verified (with "resend" when not — the account works either
 * way, a pilot at a field without signal is never held up by it), and a change of address, which
 * happens only when the link mailed to the new address is followed (react-hook-form with the zod
 * resolver: each message beside its field; bad input sends nothing).
 */
export function EmailSettings() {
  const [state, setState] = useState<State>("loading");
  const [note, setNote] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState } = useForm<ChangeEmailInput>({
    resolver: zodResolver(changeEmailSchema),
    defaultValues: { newEmail: "", currentPassword: "" },
  });
  const fe = formState.errors;

  useEffect(() => {
    fetch("/api/account/email", { cache: "no-store" })
      .then((r) => (r.ok ? r.json() : "offline"))
      .then((s: State) => setState(s))
      .catch(() => setState("offline"));
  }, []);

  async function resend() {
    const reply = await sendJson("POST", "/api/account/verification", {});
    setNote(reply.ok ? "Sent. Check your e-mail for the link." : (reply.message ?? "Could not send."));
  }

  async function onValid(data: ChangeEmailInput) {
    setFormError(null);
    const reply = await sendJson("POST", "/api/account/email", data);
    if (!reply.ok) {
      if (reply.code === "wrong_password") return setError("currentPassword", { message: reply.message });
      const byField = fieldErrors<keyof ChangeEmailInput>(reply.issues ?? []);
      for (const [name, message] of Object.entries(byField)) setError(name as keyof ChangeEmailInput, { message });
      if (Object.keys(byField).length === 0) setFormError(reply.message ?? "Something went wrong. Try again.");
      return;
    }
    reset();
    setNote(`We have sent a link to ${data.newEmail}. Your address changes when you follow it.`);
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
      <form onSubmit={(e) => void handleSubmit(onValid)(e)} className="space-y-3" noValidate aria-label="Change e-mail address">
        <TextField id="new-email" type="email" label="New e-mail address" autoComplete="email" required {...register("newEmail")} error={fe.newEmail?.message} />
        <TextField id="email-current-password" type="password" label="Your password, to change the address" autoComplete="current-password" required {...register("currentPassword")} error={fe.currentPassword?.message} />
        <p role="alert" className="font-semibold text-danger empty:hidden">
          {formError}
        </p>
        <Button type="submit" variant="secondary" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? "Sending…" : "Change e-mail address"}
        </Button>
      </form>
    </div>
  );
}
