"use client";

import { signIn } from "next-auth/react";
import { useRouter, useSearchParams } from "next/navigation";
import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { safeNextPath } from "@/lib/security/safe-next";
import { signInSchema } from "@/lib/validations/auth";

const WRONG = "E-mail or password is wrong.";

/**
 * What a failed sign-in says. "throttled:<minutes>" comes from the attempt limits (lib/auth/attempts.ts),
 * which count unknown addresses exactly like accounts, so neither message tells whether one exists.
 */
export function signInErrorMessage(error: string | undefined): string {
  const throttled = /^throttled(?::(\d+))?$/.exec(error ?? "");
  if (!throttled) return WRONG;
  const minutes = Number(throttled[1] ?? 0);
  const wait = minutes > 90 ? "later today" : `in ${minutes || "a few"} minute${minutes === 1 ? "" : "s"}`;
  return `Too many attempts for this e-mail from this network. Try again ${wait}, or from another network.`;
}

/** E-mail + password; the same message for an unknown address and a wrong password. */
export function SignInForm({ initialEmail = "" }: { initialEmail?: string }) {
  const router = useRouter();
  const params = useSearchParams();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    const parsed = signInSchema.safeParse({ email: form.get("email"), password: form.get("password") });
    if (!parsed.success) return setError(parsed.error.issues[0]?.message ?? "Check the form.");
    setBusy(true);
    setError(null);
    const res = await signIn("credentials", { ...parsed.data, redirect: false });
    setBusy(false);
    if (!res || res.error) return setError(signInErrorMessage(res?.error ?? undefined));
    router.replace(safeNextPath(params.get("next"))); // only a path on this site: never leave it
    router.refresh();
  }

  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <TextField id="email" name="email" type="email" label="E-mail" autoComplete="email" required defaultValue={initialEmail} />
      <TextField id="password" name="password" type="password" label="Password" autoComplete="current-password" required />
      <p role="alert" aria-live="assertive" className="min-h-6 font-semibold text-danger">
        {error}
      </p>
      <Button type="submit" disabled={busy} className="w-full">
        {busy ? "Signing in…" : "Sign in"}
      </Button>
    </form>
  );
}
