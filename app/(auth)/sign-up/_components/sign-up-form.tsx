"use client";

import { Suspense, useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { signUpSchema } from "@/lib/validations/auth";
import { SignInForm } from "../../sign-in/_components/sign-in-form";

type Errors = Partial<Record<"name" | "email" | "password" | "form", string>>;

/**
 * Name, e-mail, password; validated here and again on the server with the same schema. The server
 * answers the same whether or not the address was taken (and mails either a verification link or, to
 * the owner of a taken address, a notice), and so does this page: "check your e-mail", then an
 * ordinary sign-in form. It never signs in by itself (a taken address would fail where a new one
 * succeeds); the sign-in answers a taken address's wrong password like any other wrong password.
 */
export function SignUpForm() {
  const [errors, setErrors] = useState<Errors>({});
  const [busy, setBusy] = useState(false);
  const [made, setMade] = useState<string | null>(null);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    const parsed = signUpSchema.safeParse({ name: form.get("name"), email: form.get("email"), password: form.get("password") });
    if (!parsed.success) {
      const next: Errors = {};
      for (const issue of parsed.error.issues) next[issue.path[0] as keyof Errors] ??= issue.message;
      return setErrors(next);
    }
    setBusy(true);
    setErrors({});
    const res = await fetch("/api/account/sign-up", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify(parsed.data),
    }).catch(() => null);
    setBusy(false);
    if (!res?.ok) {
      const body = (await res?.json().catch(() => null)) as { error?: { message?: string } } | null;
      return setErrors({ form: body?.error?.message ?? "Could not reach the server. Try again when online." });
    }
    setMade(parsed.data.email);
  }

  if (made !== null) {
    return (
      <div className="space-y-4">
        <p role="status" className="font-semibold">
          Check your e-mail: we have sent a message to {made}. You can sign in now with the password you chose; confirm your
          address from that message when you have a connection.
        </p>
        <Suspense>
          <SignInForm initialEmail={made} />
        </Suspense>
      </div>
    );
  }

  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <TextField id="name" name="name" label="Name" autoComplete="name" required error={errors.name} />
      <TextField id="email" name="email" type="email" label="E-mail" autoComplete="email" required error={errors.email} />
      <TextField id="password" name="password" type="password" label="Password (at least 10 characters)" autoComplete="new-password" required error={errors.password} />
      <p role="alert" aria-live="assertive" className="min-h-6 font-semibold text-danger">
        {errors.form}
      </p>
      <Button type="submit" disabled={busy} className="w-full">
        {busy ? "Creating…" : "Create account"}
      </Button>
    </form>
  );
}
