"use client";

import { signIn } from "next-auth/react";
import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { changePasswordSchema } from "@/lib/validations/account";
import { accountRequest, fieldErrors, signOutHere } from "./account-request";

type Errors = Partial<Record<"currentPassword" | "newPassword" | "form", string>>;

/**
 * Current + new password. The server signs out every session of the account; this browser then
 * signs in again with the new password, so it alone stays signed in (if that fails, it is signed
 * out and the sign-in page asks for the new password).
 */
export function ChangePasswordForm({ email }: { email: string }) {
  const router = useRouter();
  const [errors, setErrors] = useState<Errors>({});
  const [done, setDone] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = e.currentTarget;
    const data = new FormData(form);
    setDone(null);
    const parsed = changePasswordSchema.safeParse({ currentPassword: data.get("currentPassword"), newPassword: data.get("newPassword") });
    if (!parsed.success) return setErrors(fieldErrors(parsed.error.issues));
    setBusy(true);
    setErrors({});
    const reply = await accountRequest("/api/account/password", "POST", parsed.data);
    if (!reply.ok) {
      setBusy(false);
      if (reply.code === "wrong_password") return setErrors({ currentPassword: reply.message });
      const byField = fieldErrors<keyof Errors>(reply.issues ?? []);
      return setErrors(Object.keys(byField).length ? byField : { form: reply.message });
    }
    const again = await signIn("credentials", { email, password: parsed.data.newPassword, redirect: false });
    setBusy(false);
    if (!again || again.error) return signOutHere("?changed=password");
    form.reset();
    setDone("Password changed. Your other devices are signed out; this one stays signed in.");
    router.refresh();
  }

  return (
    <form onSubmit={onSubmit} className="space-y-3" noValidate aria-labelledby="password-h">
      <h3 id="password-h" className="font-bold">
        Change password
      </h3>
      <TextField id="current-password" name="currentPassword" type="password" label="Current password" autoComplete="current-password" required error={errors.currentPassword} />
      <TextField id="new-password" name="newPassword" type="password" label="New password (at least 10 characters)" autoComplete="new-password" required error={errors.newPassword} />
      <p role="status" aria-live="polite" className="font-semibold text-danger empty:hidden">
        {errors.form}
      </p>
      <p role="status" aria-live="polite" className="font-semibold empty:hidden">
        {done}
      </p>
      <Button type="submit" variant="secondary" disabled={busy}>
        {busy ? "Changing…" : "Change password"}
      </Button>
    </form>
  );
}
