"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { TextField } from "@/components/ui/field";
import { FormFooter } from "@/components/ui/form-footer";
import { openClubDaySchema, type OpenClubDay } from "@/lib/validations/club-days";
import { sendJson } from "@/components/request/json";

/** An officer opens a field day at one of the club's fields; the Day board opens once it is there. */
export function OpenDayForm({ slug, fields, today }: { slug: string; fields: { id: string; name: string }[]; today: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<OpenClubDay>({
    resolver: zodResolver(openClubDaySchema),
    defaultValues: { fieldId: fields[0]?.id ?? "", day: today },
  });
  const fe = formState.errors;

  async function onValid(data: OpenClubDay) {
    setError(null);
    const reply = await sendJson("POST", `/api/clubs/${slug}/days`, data);
    if (!reply.ok) return setError(reply.message);
    router.push(`/clubs/${slug}/days/${data.day}`);
  }

  return (
    <form onSubmit={handleSubmit(onValid)} className="space-y-3" noValidate aria-label="Open a field day">
      <div className="space-y-1">
        <label htmlFor="day-field" className="block font-semibold">
          Field
        </label>
        <select id="day-field" {...register("fieldId")} aria-invalid={fe.fieldId ? true : undefined} className="min-h-12 w-full rounded-lg border-2 border-line bg-raised px-2">
          {fields.map((f) => (
            <option key={f.id} value={f.id}>
              {f.name}
            </option>
          ))}
        </select>
        {fe.fieldId ? <p className="text-sm font-semibold text-danger">{fe.fieldId.message}</p> : null}
      </div>
      <TextField id="day-date" label="Day" type="date" {...register("day")} error={fe.day?.message} />
      <FormFooter error={error} submitting={formState.isSubmitting} label="Open the day" busyLabel="Opening…" />
    </form>
  );
}
