"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { TextField } from "@/components/ui/field";
import { FormFooter } from "@/components/ui/form-footer";
import { resetPasswordFormSchema, type ResetPasswordFormInput } from "@/lib/validations/email";
import { sendJson } from "@/components/request/json";

/**
 * The new password for the account the link was sent to (react-hook-form with the zod resolver:
 * the message beside the field; a password the rules refuse sends nothing); a used or expired
 * link says so.
 */
export function ResetPasswordForm({ token }: { token: string }) {
  const [error, setError] = useState<string | undefined>();
  const [done, setDone] = useState(false);
  const form = useForm<ResetPasswordFormInput>({ resolver: zodResolver(resetPasswordFormSchema), defaultValues: { password: "" } });

  async function onValid({ password }: ResetPasswordFormInput) {
    setError(undefined);
    const reply = await sendJson("POST", "/api/account/reset-password", { token, password });
    if (!reply.ok) {
      const onField = reply.issues?.find((i) => i.path === "password")?.message;
      if (onField) return form.setError("password", { message: onField });
      return setError(reply.message);
    }
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
    <form onSubmit={(e) => void form.handleSubmit(onValid)(e)} className="space-y-4" noValidate>
      <TextField id="password" type="password" label="New password (at least 10 characters)" autoComplete="new-password" required {...form.register("password")} error={form.formState.errors.password?.message} />
      <FormFooter error={error} submitting={form.formState.isSubmitting} label="Set new password" busyLabel="Saving…" />
      <p>
        <Link href="/forgot-password" className="underline">
          Ask for a new link
        </Link>
      </p>
    </form>
  );
}
