"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { forgotPasswordSchema, type ForgotPasswordInput } from "@/lib/validations/email";
import { sendJson } from "@/components/request/json";

/**
 * Asks for a reset link (react-hook-form with the zod resolver: the message beside the field; a
 * malformed address sends nothing). The page says the same whether or not the address has an account.
 */
export function ForgotPasswordForm({ initialEmail }: { initialEmail: string }) {
  const [sentTo, setSentTo] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<ForgotPasswordInput>({ resolver: zodResolver(forgotPasswordSchema), defaultValues: { email: initialEmail } });

  async function onValid(data: ForgotPasswordInput) {
    const reply = await sendJson("POST", "/api/account/forgot-password", data);
    if (!reply.ok) return setError("email", { message: reply.message });
    setSentTo(data.email);
  }

  if (sentTo) {
    return (
      <p role="status" className="font-semibold">
        Check your e-mail. If an account uses {sentTo}, we have sent it a link to choose a new password. The link works once, for 45 minutes.
      </p>
    );
  }
  return (
    <form onSubmit={(e) => void handleSubmit(onValid)(e)} className="space-y-4" noValidate>
      <TextField id="email" type="email" label="E-mail" autoComplete="email" required {...register("email")} error={formState.errors.email?.message} />
      <Button type="submit" disabled={formState.isSubmitting} className="w-full">
        {formState.isSubmitting ? "Sending…" : "Send me a link"}
      </Button>
    </form>
  );
}
