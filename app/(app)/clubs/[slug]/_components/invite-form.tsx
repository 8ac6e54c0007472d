"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { ROLE_LABEL } from "@/lib/clubs/roles";
import { CLUB_ROLES, inviteSchema, type InviteInput } from "@/lib/validations/clubs";
import { sendJson } from "@/components/request/json";

/** An officer invites by e-mail with a role: the invitee gets a one-time link that works for 7 days. */
export function InviteForm({ slug }: { slug: string }) {
  const router = useRouter();
  const [result, setResult] = useState<{ ok: boolean; message: string } | null>(null);
  const { register, handleSubmit, formState, reset } = useForm<InviteInput>({ resolver: zodResolver(inviteSchema), defaultValues: { email: "", role: "member" } });

  async function onValid(data: InviteInput) {
    setResult(null);
    const reply = await sendJson("POST", `/api/clubs/${slug}/invitations`, data);
    if (!reply.ok) return setResult({ ok: false, message: reply.message });
    reset();
    setResult({ ok: true, message: `Invitation sent to ${data.email}.` });
    router.refresh();
  }

  return (
    <form onSubmit={handleSubmit(onValid)} className="space-y-3" noValidate>
      <TextField id="invite-email" type="email" label="E-mail to invite" autoComplete="off" {...register("email")} error={formState.errors.email?.message} />
      <div className="space-y-1">
        <label htmlFor="invite-role" className="block font-semibold">
          Role
        </label>
        <select id="invite-role" {...register("role")} className="block min-h-14 w-full rounded-lg border-2 border-line bg-raised px-3 text-lg">
          {CLUB_ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_LABEL[r]}
            </option>
          ))}
        </select>
      </div>
      <p role={result?.ok ? "status" : "alert"} aria-live="polite" className={`min-h-6 font-semibold ${result?.ok ? "" : "text-danger"}`}>
        {result?.message}
      </p>
      <Button type="submit" disabled={formState.isSubmitting} className="w-full">
        {formState.isSubmitting ? "Sending…" : "Send the invitation"}
      </Button>
    </form>
  );
}
