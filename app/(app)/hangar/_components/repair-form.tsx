"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { requestJson } from "@/components/request/json";

/** Logs a repair: when, what was done, the mass after it (becomes the model's mass). */
export function RepairForm({ modelId }: { modelId: string }) {
  const router = useRouter();
  const [form, setForm] = useState({ repairedOn: new Date().toISOString().slice(0, 10), work: "", massAfterG: "" });
  const [error, setError] = useState<string | null>(null);
  const set = (k: keyof typeof form) => (e: { target: { value: string } }) => setForm({ ...form, [k]: e.target.value });
  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setError(null);
    try {
      await requestJson("POST", `/api/models/${modelId}/repairs`, { ...form, massAfterG: form.massAfterG ? Number(form.massAfterG) : null });
      setForm({ ...form, work: "", massAfterG: "" });
      router.refresh();
    } catch (err) {
      setError((err as Error).message);
    }
  }
  return (
    <form onSubmit={submit} className="space-y-3" aria-label="Log a repair">
      <TextField id="repair-date" type="date" label="Date" value={form.repairedOn} onChange={set("repairedOn")} required />
      <TextField id="repair-work" label="What was done" value={form.work} onChange={set("work")} required maxLength={2000} />
      <TextField id="repair-mass" label="Mass after (g, optional)" inputMode="numeric" value={form.massAfterG} onChange={set("massAfterG")} />
      {error ? <p role="alert" className="font-semibold text-danger">{error}</p> : null}
      <Button type="submit" variant="secondary">Log the repair</Button>
    </form>
  );
}
