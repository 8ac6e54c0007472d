"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { classCautions } from "@/lib/hangar/limits";
import { requestJson } from "@/components/request/json";

/** Adds a model. Over the class limits it warns as you type, and still saves. */
export function ModelForm() {
  const router = useRouter();
  const [form, setForm] = useState({ name: "", spanMm: "", massG: "", marking: "", notes: "" });
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const set = (k: keyof typeof form) => (e: { target: { value: string } }) => setForm({ ...form, [k]: e.target.value });
  const cautions = form.spanMm && form.massG ? classCautions({ spanMm: Number(form.spanMm), massG: Number(form.massG) }) : [];
  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setError(null);
    try {
      const { model } = await requestJson<{ model: { id: string } }>("POST", "/api/models", { ...form, spanMm: Number(form.spanMm), massG: Number(form.massG) });
      router.push(`/hangar/${model.id}`);
    } catch (err) {
      setError((err as Error).message);
      setBusy(false);
    }
  }
  return (
    <form onSubmit={submit} className="space-y-3">
      <TextField id="model-name" label="Name" value={form.name} onChange={set("name")} required maxLength={80} />
      <TextField id="model-span" label="Span (mm)" inputMode="numeric" value={form.spanMm} onChange={set("spanMm")} required />
      <TextField id="model-mass" label="Mass ready to fly (g)" inputMode="numeric" value={form.massG} onChange={set("massG")} required />
      <TextField id="model-marking" label="Colour and marking" value={form.marking} onChange={set("marking")} maxLength={200} />
      <TextField id="model-notes" label="Notes" value={form.notes} onChange={set("notes")} maxLength={4000} />
      {cautions.map((c) => <p key={c} role="status" className="font-semibold text-warn">Caution: {c}</p>)}
      {error ? <p role="alert" className="font-semibold text-danger">{error}</p> : null}
      <Button type="submit" disabled={busy}>Add to the hangar</Button>
    </form>
  );
}
