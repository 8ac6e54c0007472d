"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { TextField } from "@/components/ui/field";
import { FormFooter } from "@/components/ui/form-footer";
import { createClubSchema, type CreateClubInput } from "@/lib/validations/clubs";
import { sendJson } from "@/components/request/json";

/** Start a club: its name; you become its first officer and land on its home. */
export function CreateClubForm() {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<CreateClubInput>({ resolver: zodResolver(createClubSchema), defaultValues: { name: "" } });

  async function onValid(data: CreateClubInput) {
    setError(null);
    const reply = await sendJson<{ club: { slug: string } }>("POST", "/api/clubs", data);
    if (!reply.ok) return setError(reply.message);
    router.push(`/clubs/${reply.data.club.slug}`);
  }

  return (
    <form onSubmit={handleSubmit(onValid)} className="space-y-3" noValidate>
      <TextField id="club-name" label="Club name" autoComplete="off" {...register("name")} error={formState.errors.name?.message} />
      <FormFooter error={error} submitting={formState.isSubmitting} label="Create the club" busyLabel="Creating…" />
    </form>
  );
}
