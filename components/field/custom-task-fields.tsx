"use client";

import { TextField } from "@/components/ui/field";
import type { CustomTaskInput } from "@/lib/tasks";

/** The custom task as typed; `toCustomInput` turns it into buildCustomTask's input. */
export type CustomDraft = {
  name: string;
  workingMin: string;
  counting: "all" | "best" | "last";
  count: string;
  capSec: string;
  targets: string;
  order: "in-order" | "any-order";
  launchLimit: string;
};

export const EMPTY_CUSTOM: CustomDraft = { name: "My practice task", workingMin: "10", counting: "best", count: "3", capSec: "120", targets: "", order: "in-order", launchLimit: "" };

const num = (s: string) => (s.trim() === "" ? undefined : Number(s.trim().replace(",", ".")));

/** Typed text → the engine's custom-task input; the schema (zod) reports what is wrong. */
export function toCustomInput(d: CustomDraft): CustomTaskInput {
  const targets = d.targets.split(/[\s,;]+/).filter(Boolean).map(Number);
  const minutes = num(d.workingMin);
  return {
    name: d.name,
    workingTimeSec: minutes === undefined ? Number.NaN : Math.round(minutes * 60),
    capSec: targets.length > 0 ? null : (num(d.capSec) ?? null),
    targetsSec: targets,
    order: d.order,
    counting: d.counting,
    count: targets.length > 0 && d.counting !== "all" ? targets.length : num(d.count),
    launchLimit: num(d.launchLimit) ?? null,
  };
}

/** Fields of a custom practice task: window, cap, a ladder of targets, what counts. */
export function CustomTaskFields({ draft, onChange }: { draft: CustomDraft; onChange: (d: CustomDraft) => void }) {
  const set = (patch: Partial<CustomDraft>) => onChange({ ...draft, ...patch });
  const ladder = draft.targets.trim() !== "";
  return (
    <fieldset className="space-y-3 rounded-xl border-2 border-line p-3">
      <legend className="px-1 font-bold">Your own task</legend>
      <TextField id="custom-name" label="Name" value={draft.name} onChange={(e) => set({ name: e.target.value })} />
      <TextField id="custom-wt" label="Working time (minutes)" inputMode="decimal" value={draft.workingMin} onChange={(e) => set({ workingMin: e.target.value })} />
      <TextField id="custom-targets" label="Ladder of targets, seconds (optional, e.g. 60 90 120)" value={draft.targets} onChange={(e) => set({ targets: e.target.value })} />
      {ladder ? (
        <Choice label="Targets are flown" value={draft.order} onChange={(v) => set({ order: v as CustomDraft["order"] })} options={[["in-order", "in order"], ["any-order", "in any order"]]} />
      ) : (
        <TextField id="custom-cap" label="Cap per flight, seconds (empty: no cap)" inputMode="numeric" value={draft.capSec} onChange={(e) => set({ capSec: e.target.value })} />
      )}
      <Choice label="Which flights count" value={draft.counting} onChange={(v) => set({ counting: v as CustomDraft["counting"] })} options={[["best", "the longest"], ["last", "the last"], ["all", "all of them"]]} />
      {draft.counting !== "all" && !ladder ? <TextField id="custom-count" label="How many count" inputMode="numeric" value={draft.count} onChange={(e) => set({ count: e.target.value })} /> : null}
      <TextField id="custom-launches" label="Launch limit (empty: unlimited)" inputMode="numeric" value={draft.launchLimit} onChange={(e) => set({ launchLimit: e.target.value })} />
    </fieldset>
  );
}

function Choice({ label, value, onChange, options }: { label: string; value: string; onChange: (v: string) => void; options: [string, string][] }) {
  return (
    <fieldset>
      <legend className="font-semibold">{label}</legend>
      <div className="mt-1 flex flex-wrap gap-2">
        {options.map(([v, text]) => (
          <label key={v} className={`flex min-h-12 cursor-pointer items-center gap-2 rounded-lg border-2 px-3 ${value === v ? "border-ink border-4" : "border-line"}`}>
            <input type="radio" checked={value === v} onChange={() => onChange(v)} className="h-5 w-5" />
            {text}
          </label>
        ))}
      </div>
    </fieldset>
  );
}
