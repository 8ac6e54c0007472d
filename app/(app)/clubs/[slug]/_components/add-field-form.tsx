"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { TextField } from "@/components/ui/field";
import { FormFooter } from "@/components/ui/form-footer";
import { clubFieldSchema, type ClubField, type ClubFieldInput } from "@/lib/validations/clubs";
import { sendJson } from "@/components/request/json";

const EMPTY = { name: "", latitude: "", longitude: "", launchDirection: "", safetyAreas: "", localRules: "" };

/** An officer adds a field: its name, position if known, and the notes pilots see as cautions there. */
export function AddFieldForm({ slug }: { slug: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, formState, reset } = useForm<ClubFieldInput, unknown, ClubField>({ resolver: zodResolver(clubFieldSchema), defaultValues: EMPTY });
  const fe = formState.errors;

  async function onValid(data: ClubField) {
    setError(null);
    const reply = await sendJson("POST", `/api/clubs/${slug}/fields`, data);
    if (!reply.ok) return setError(reply.message);
    reset(EMPTY);
    router.refresh();
  }

  return (
    <form onSubmit={handleSubmit(onValid)} className="space-y-3" noValidate>
      <TextField id="field-name" label="Field name" autoComplete="off" {...register("name")} error={fe.name?.message} />
      <div className="grid grid-cols-2 gap-2">
        <TextField id="field-lat" label="Latitude (optional)" inputMode="decimal" {...register("latitude")} error={fe.latitude?.message} />
        <TextField id="field-lon" label="Longitude (optional)" inputMode="decimal" {...register("longitude")} error={fe.longitude?.message} />
      </div>
      <TextField id="field-launch" label="Launch direction" {...register("launchDirection")} error={fe.launchDirection?.message} />
      <TextField id="field-safety" label="Safety areas" {...register("safetyAreas")} error={fe.safetyAreas?.message} />
      <TextField id="field-rules" label="Local rules" {...register("localRules")} error={fe.localRules?.message} />
      <FormFooter error={error} submitting={formState.isSubmitting} label="Add the field" busyLabel="Adding…" />
    </form>
  );
}
