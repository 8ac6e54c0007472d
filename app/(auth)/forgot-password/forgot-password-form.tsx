"use client";

import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { forgotPasswordSchema } from "@/lib/validations/email";
import { postJson } from "../_components/post-json";

/** Asks for a reset link. The page says the same whether or not the address has an account. */
export function ForgotPasswordForm({ initialEmail }: { initialEmail: string }) {
  const [error, setError] = useState<string | undefined>();
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const parsed = forgotPasswordSchema.safeParse({ email: new FormData(e.currentTarget).get("email") });
    if (!parsed.success) return setError(parsed.error.issues[0]?.message);
    setBusy(true);
    setError(undefined);
    const reply = await postJson("/api/account/forgot-password", parsed.data);
    setBusy(false);
    if (!reply.ok) return setError(reply.message);
    setSentTo(parsed.data.email);
  }

  if (sentTo) {
    return (
      <p role="status" className="font-semibold">
        Check your e-mail. If an account uses {sentTo}, we have sent it a link to choose a new password. The link works once, for 45 minutes.
      </p>
    );
  }
  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <TextField id="email" name="email" type="email" label="E-mail" autoComplete="email" required defaultValue={initialEmail} error={error} />
      <Button type="submit" disabled={busy} className="w-full">
        {busy ? "Sending…" : "Send me a link"}
      </Button>
    </form>
  );
}
