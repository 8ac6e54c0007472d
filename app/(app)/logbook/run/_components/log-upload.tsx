"use client";

import { useEffect, useState } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import type { LoggerMapping } from "@/lib/altimeter/mapping";
import { putWithProgress } from "./put-with-progress";

type Phase = { kind: "idle" } | { kind: "uploading"; fraction: number } | { kind: "reading" } | { kind: "dropped" } | { kind: "error"; message: string } | { kind: "done"; message: string };
const DEFAULT: LoggerMapping = { hasHeader: true, timeColumn: 1, timeKind: "seconds", utcOffsetMin: 0, valueColumn: 2, valueKind: "m" };
const MAX_BYTES = 5 * 1024 * 1024;

async function post<T>(url: string, body: unknown): Promise<T> {
  const res = await fetch(url, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
  const data = (await res.json().catch(() => ({}))) as T & { error?: { message?: string } };
  if (!res.ok) throw new Error(data.error?.message ?? `The server answered ${res.status}.`);
  return data;
}

/** Uploads an altimeter CSV for one lane: column mapping (saved per logger), progress, retry after a dropped connection. */
export function LogUpload({ runId, lane, onDone }: { runId: string; lane: number; onDone: () => void }) {
  const [saved, setSaved] = useState<{ loggerName: string; mapping: LoggerMapping }[]>([]);
  const [loggerName, setLoggerName] = useState("");
  const [mapping, setMapping] = useState<LoggerMapping>({ ...DEFAULT, utcOffsetMin: -new Date().getTimezoneOffset() });
  const [start, setStart] = useState("");
  const [file, setFile] = useState<File | null>(null);
  const [phase, setPhase] = useState<Phase>({ kind: "idle" });
  const [pending, setPending] = useState<{ logId: string; url: string } | null>(null);
  useEffect(() => {
    fetch("/api/logger-mappings").then((r) => (r.ok ? r.json() : { loggers: [] })).then((d: { loggers: typeof saved }) => {
      setSaved(d.loggers);
      if (d.loggers[0]) { setLoggerName(d.loggers[0].loggerName); setMapping(d.loggers[0].mapping); }
    }).catch(() => undefined);
  }, []);
  const pick = (name: string) => {
    setLoggerName(name);
    const known = saved.find((s) => s.loggerName === name);
    if (known) setMapping(known.mapping);
  };
  const set = <K extends keyof LoggerMapping>(k: K, v: LoggerMapping[K]) => setMapping({ ...mapping, [k]: v });
  const upload = { loggerName, mapping, startAtMs: mapping.timeKind === "seconds" && start ? new Date(start).getTime() : undefined };

  async function send(target: { logId: string; url: string }) {
    if (!file) return;
    setPhase({ kind: "uploading", fraction: 0 });
    try {
      const status = await putWithProgress(target.url, file, "text/csv", (fraction) => setPhase({ kind: "uploading", fraction }));
      if (status >= 300) throw new Error(`The storage refused the file (${status}).`);
    } catch (e) {
      if ((e as Error).message === "network") return setPhase({ kind: "dropped" });
      return setPhase({ kind: "error", message: (e as Error).message });
    }
    setPhase({ kind: "reading" });
    try {
      const r = await post<{ launches: { flightIndex: number | null }[] }>(`/api/logs/${target.logId}/complete`, upload);
      setPending(null);
      setPhase({ kind: "done", message: `Read: ${r.launches.length} launches found, ${r.launches.filter((l) => l.flightIndex !== null).length} matched to flights.` });
      onDone();
    } catch (e) {
      setPending(null);
      setPhase({ kind: "error", message: (e as Error).message });
    }
  }

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    if (!file) return;
    if (file.size > MAX_BYTES) return setPhase({ kind: "error", message: "An altimeter log may be at most 5 MB." });
    try {
      const target = await post<{ logId: string; url: string }>(`/api/runs/${runId}/logs`, { ...upload, lane, fileName: file.name, sizeBytes: file.size, contentType: "text/csv" });
      setPending(target);
      await send(target);
    } catch (err) {
      setPhase({ kind: "error", message: (err as Error).message });
    }
  }

  const id = (x: string) => `log-${lane}-${x}`;
  return (
    <form onSubmit={submit} className="space-y-3 rounded-xl border-2 border-line p-3" aria-label={`Upload an altimeter log, lane ${lane + 1}`}>
      <TextField id={id("logger")} label="Logger" list={id("loggers")} value={loggerName} onChange={(e) => pick(e.target.value)} required maxLength={60} />
      <datalist id={id("loggers")}>{saved.map((s) => <option key={s.loggerName} value={s.loggerName} />)}</datalist>
      <TextField id={id("file")} label="CSV file (at most 5 MB)" type="file" accept=".csv,text/csv" onChange={(e) => setFile(e.target.files?.[0] ?? null)} required />
      <label className="flex items-center gap-2"><input type="checkbox" checked={mapping.hasHeader} onChange={(e) => set("hasHeader", e.target.checked)} /> First line is a header</label>
      <div className="grid grid-cols-2 gap-3">
        <TextField id={id("time-col")} label="Time column" type="number" min={1} max={64} value={mapping.timeColumn} onChange={(e) => set("timeColumn", Number(e.target.value))} />
        <TextField id={id("value-col")} label="Height column" type="number" min={1} max={64} value={mapping.valueColumn} onChange={(e) => set("valueColumn", Number(e.target.value))} />
      </div>
      <label className="block font-semibold" htmlFor={id("time-kind")}>Time is</label>
      <select id={id("time-kind")} className="min-h-14 w-full rounded-lg border-2 border-line bg-raised px-3" value={mapping.timeKind} onChange={(e) => set("timeKind", e.target.value as LoggerMapping["timeKind"])}>
        <option value="seconds">seconds from a start I give</option>
        <option value="clock">clock time of day (hh:mm:ss)</option>
      </select>
      {mapping.timeKind === "seconds" ? <TextField id={id("start")} label="Log started at" type="datetime-local" step={1} value={start} onChange={(e) => setStart(e.target.value)} required />
        : <TextField id={id("offset")} label="Logger clock, minutes from UTC" type="number" value={mapping.utcOffsetMin} onChange={(e) => set("utcOffsetMin", Number(e.target.value))} />}
      <label className="block font-semibold" htmlFor={id("unit")}>Height column holds</label>
      <select id={id("unit")} className="min-h-14 w-full rounded-lg border-2 border-line bg-raised px-3" value={mapping.valueKind} onChange={(e) => set("valueKind", e.target.value as LoggerMapping["valueKind"])}>
        <option value="m">height in metres</option>
        <option value="ft">height in feet</option>
        <option value="hPa">pressure in hPa (standard atmosphere)</option>
      </select>
      {phase.kind === "uploading" ? <progress className="w-full" max={1} value={phase.fraction} aria-label="Upload progress" /> : null}
      {phase.kind === "reading" ? <p role="status">Reading the log…</p> : null}
      {phase.kind === "dropped" && pending ? (
        <p role="alert" className="font-semibold text-warn">The connection dropped. <Button type="button" variant="secondary" onClick={() => void send(pending)}>Retry the upload</Button></p>
      ) : null}
      {phase.kind === "error" ? <p role="alert" className="font-semibold text-danger">{phase.message}</p> : null}
      {phase.kind === "done" ? <p role="status">{phase.message}</p> : null}
      <Button type="submit" variant="secondary" disabled={phase.kind === "uploading" || phase.kind === "reading"}>Upload the log</Button>
    </form>
  );
}
