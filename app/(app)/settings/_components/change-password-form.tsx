"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { signIn } from "next-auth/react";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { useSync } from "@/components/sync/sync-provider";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { changePasswordSchema, type ChangePasswordInput } from "@/lib/validations/account";
import { sendJson } from "@/components/request/json";
import { fieldErrors, signOutHere } from "./account-session";

/**
 * Current + new password (react-hook-form with the zod resolver: each message beside its field;
 * bad input sends nothing). The server signs out every session of the account; this browser then
 * signs in again with the new password, so it alone stays signed in (if that fails, it is signed
 * out and the sign-in page asks for the new password).
 */
export function ChangePasswordForm({ email }: { email: string }) {
  const { client } = useSync();
  const router = useRouter();
  const [formError, setFormError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState } = useForm<ChangePasswordInput>({
    resolver: zodResolver(changePasswordSchema),
    defaultValues: { currentPassword: "", newPassword: "" },
  });
  const fe = formState.errors;

  async function onValid(data: ChangePasswordInput) {
    setDone(null);
    setFormError(null);
    const reply = await sendJson("POST", "/api/account/password", data);
    if (!reply.ok) {
      if (reply.code === "wrong_password") return setError("currentPassword", { message: reply.message });
      const byField = fieldErrors<keyof ChangePasswordInput>(reply.issues ?? []);
      for (const [name, message] of Object.entries(byField)) setError(name as keyof ChangePasswordInput, { message });
      if (Object.keys(byField).length === 0) setFormError(reply.message ?? "Something went wrong. Try again.");
      return;
    }
    const again = await signIn("credentials", { email, password: data.newPassword, redirect: false });
    if (!again || again.error) return signOutHere("?changed=password", client);
    reset();
    setDone("Password changed. Your other devices are signed out; this one stays signed in.");
    router.refresh();
  }

  return (
    <form onSubmit={(e) => void handleSubmit(onValid)(e)} className="space-y-3" noValidate aria-labelledby="password-h">
      <h3 id="password-h" className="font-bold">
        Change password
      </h3>
      <TextField id="current-password" type="password" label="Current password" autoComplete="current-password" required {...register("currentPassword")} error={fe.currentPassword?.message} />
      <TextField id="new-password" type="password" label="New password (at least 10 characters)" autoComplete="new-password" required {...register("newPassword")} error={fe.newPassword?.message} />
      <p role="status" aria-live="polite" className="font-semibold text-danger empty:hidden">
        {formError}
      </p>
      <p role="status" aria-live="polite" className="font-semibold empty:hidden">
        {done}
      </p>
      <Button type="submit" variant="secondary" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? "Changing…" : "Change password"}
      </Button>
    </form>
  );
}
