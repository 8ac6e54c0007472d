"use client";

import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { deleteAccountSchema } from "@/lib/validations/account";
import { accountRequest, fieldErrors, signOutHere } from "./account-request";

/** Deletes the account after its password is typed again; says plainly what is kept for others. */
export function DeleteAccountForm() {
  const [error, setError] = useState<string | undefined>();
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const parsed = deleteAccountSchema.safeParse({ password: new FormData(e.currentTarget).get("password") });
    if (!parsed.success) return setError(fieldErrors<"password">(parsed.error.issues).password);
    setBusy(true);
    setError(undefined);
    const reply = await accountRequest("/api/account", "DELETE", parsed.data);
    if (!reply.ok) {
      setBusy(false);
      return setError(fieldErrors<"password">(reply.issues ?? []).password ?? reply.message);
    }
    await signOutHere("?deleted=1");
  }

  return (
    <form onSubmit={onSubmit} className="space-y-3" noValidate aria-labelledby="delete-h">
      <h3 id="delete-h" className="font-bold">
        Delete my account
      </h3>
      <p className="text-muted">
        Your sessions, runs and coach grants are removed. Results in other pilots&apos; runs stay in their logbooks under the
        name &quot;Deleted pilot&quot;. This cannot be undone; download your data first if you want a copy.
      </p>
      <TextField id="delete-password" name="password" type="password" label="Your password, to confirm" autoComplete="current-password" required error={error} />
      <Button type="submit" variant="danger" disabled={busy}>
        {busy ? "Deleting…" : "Delete my account"}
      </Button>
    </form>
  );
}
