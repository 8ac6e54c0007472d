"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { Suspense, useState } from "react";
import { useForm } from "react-hook-form";
import { sendJson } from "@/components/request/json";
import { TextField } from "@/components/ui/field";
import { FormFooter } from "@/components/ui/form-footer";
import { signUpSchema, type SignUpInput } from "@/lib/validations/auth";
import { SignInForm } from "../../sign-in/_components/sign-in-form";

/**
 * Name, e-mail, password; validated here and again on the server with the same schema. The server
 * answers the same whether or not the address was taken (and mails either a verification link or, to
 * the owner of a taken address, a notice), and so does this page: "check your e-mail", then an
 * ordinary sign-in form. It never signs in by itself (a taken address would fail where a new one
 * succeeds); the sign-in answers a taken address's wrong password like any other wrong password.
 */
export function SignUpForm() {
  const [formError, setFormError] = useState<string | null>(null);
  const [made, setMade] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<SignUpInput>({ resolver: zodResolver(signUpSchema), defaultValues: { name: "", email: "", password: "" } });
  const fe = formState.errors;

  async function onValid(data: SignUpInput) {
    setFormError(null);
    const reply = await sendJson("POST", "/api/account/sign-up", data);
    if (!reply.ok) return setFormError(reply.message);
    setMade(data.email);
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
    <form onSubmit={handleSubmit(onValid)} className="space-y-4" noValidate>
      <TextField id="name" label="Name" autoComplete="name" required {...register("name")} error={fe.name?.message} />
      <TextField id="email" type="email" label="E-mail" autoComplete="email" required {...register("email")} error={fe.email?.message} />
      <TextField id="password" type="password" label="Password (at least 10 characters)" autoComplete="new-password" required {...register("password")} error={fe.password?.message} />
      <FormFooter error={formError} submitting={formState.isSubmitting} label="Create account" busyLabel="Creating…" />
    </form>
  );
}
