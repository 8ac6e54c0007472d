"use client";

import { useRouter, useSearchParams } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { TextField } from "@/components/ui/field";
import { FormFooter } from "@/components/ui/form-footer";
import { lazyResolver } from "@/components/ui/lazy-resolver";
import { safeNextPath } from "@/lib/security/safe-next";
import type { SignInInput } from "@/lib/validations/auth";

const WRONG = "E-mail or password is wrong.";
/** The form's check or next-auth's client did not load (a phone with no signal on its first send): nothing was sent. */
const NO_SIGNAL = "No connection: try again when you have a signal.";

// zod, the form's schema and next-auth's client load when the form is first sent, not with the page.
const resolver = lazyResolver<SignInInput>(async () => {
  const [{ zodResolver }, { signInSchema }] = await Promise.all([import("@hookform/resolvers/zod"), import("@/lib/validations/auth")]);
  return zodResolver(signInSchema);
});

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

/**
 * E-mail + password (react-hook-form with the zod resolver, loaded on the first submit: a message
 * beside each field); the same message for an unknown address and a wrong password.
 */
export function SignInForm({ initialEmail = "" }: { initialEmail?: string }) {
  const router = useRouter();
  const params = useSearchParams();
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<SignInInput>({ resolver, defaultValues: { email: initialEmail, password: "" } });
  const fe = formState.errors;

  async function onValid(data: SignInInput) {
    setError(null);
    const { signIn } = await import("next-auth/react");
    const res = await signIn("credentials", { ...data, redirect: false });
    if (!res || res.error) return setError(signInErrorMessage(res?.error ?? undefined));
    router.replace(safeNextPath(params.get("next"))); // only a path on this site: never leave it
    router.refresh();
  }

  return (
    <form onSubmit={(e) => handleSubmit(onValid)(e).catch(() => setError(NO_SIGNAL))} className="space-y-4" noValidate>
      <TextField id="email" type="email" label="E-mail" autoComplete="email" required {...register("email")} error={fe.email?.message} />
      <TextField id="password" type="password" label="Password" autoComplete="current-password" required {...register("password")} error={fe.password?.message} />
      <FormFooter error={error} submitting={formState.isSubmitting} label="Sign in" busyLabel="Signing in…" />
    </form>
  );
}
