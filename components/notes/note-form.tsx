"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/form-footer";
import { useOnline } from "@/components/sync/use-online";
import { NOTE_BODY_MAX, noteReplySchema } from "@/lib/validations/coach";

type Values = { body: string };

/** One text box and a send button for a note or an answer; needs a connection (the server decides who may write). */
export function NoteForm({ id, label, submitLabel, onSend }: { id: string; label: string; submitLabel: string; onSend: (body: string) => Promise<void> }) {
  const online = useOnline();
  const [problem, setProblem] = useState<string | null>(null);
  const { register, handleSubmit, reset, formState } = useForm<Values>({ resolver: zodResolver(noteReplySchema), defaultValues: { body: "" } });
  const error = formState.errors.body?.message;
  const send = async (v: Values) => {
    setProblem(null);
    try {
      await onSend(v.body);
      reset({ body: "" });
    } catch (e) {
      setProblem(e instanceof Error ? e.message : "Nothing was sent. Try again.");
    }
  };
  return (
    <form className="space-y-2" noValidate onSubmit={(e) => void handleSubmit(send)(e)}>
      <label htmlFor={id} className="block font-semibold">{label}</label>
      <textarea
        id={id}
        rows={3}
        maxLength={NOTE_BODY_MAX}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        className="block w-full rounded-lg border-2 border-line bg-raised p-3 text-base text-ink"
        {...register("body")}
      />
      {error ? <p id={`${id}-error`} className="text-sm font-semibold text-danger">{error}</p> : null}
      <Button type="submit" variant="secondary" disabled={!online || formState.isSubmitting}>{submitLabel}</Button>
      <FormError message={!online ? "Writing needs a connection; the notes below are from the last sync." : problem} />
    </form>
  );
}
