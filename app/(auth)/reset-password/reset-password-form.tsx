"use client";

import Link from "next/link";
import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { passwordSchema } from "@/lib/validations/auth";
import { postJson } from "../_components/post-json";

/** The new password for the account the link was sent to; a used or expired link says so. */
export function ResetPasswordForm({ token }: { token: string }) {
  const [error, setError] = useState<string | undefined>();
  const [done, setDone] = useState(false);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const parsed = passwordSchema.safeParse(new FormData(e.currentTarget).get("password"));
    if (!parsed.success) return setError(parsed.error.issues[0]?.message);
    setBusy(true);
    setError(undefined);
    const reply = await postJson("/api/account/reset-password", { token, password: parsed.data });
    setBusy(false);
    if (!reply.ok) return setError(reply.issues?.find((i) => i.path === "password")?.message ?? reply.message);
    setDone(true);
  }

  if (done) {
    return (
      <div className="space-y-4">
        <p role="status" className="font-semibold">
          Your password is changed, and every phone and browser that was signed in to your account is signed out.
        </p>
        <Link href="/sign-in" className="font-bold underline">
          Sign in with the new password
        </Link>
      </div>
    );
  }
  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <TextField id="password" name="password" type="password" label="New password (at least 10 characters)" autoComplete="new-password" required />
      <p role="alert" aria-live="assertive" className="min-h-6 font-semibold text-danger">
        {error}
      </p>
      <Button type="submit" disabled={busy} className="w-full">
        {busy ? "Saving…" : "Set new password"}
      </Button>
      <p>
        <Link href="/forgot-password" className="underline">
          Ask for a new link
        </Link>
      </p>
    </form>
  );
}
