"use client";

import type { SeasonFilters } from "@/lib/validations/season";

const TASKS = ["A", "B", "C", "D", "E", "F", "G", "H", "I", "J", "K", "L", "M", "N"] as const;
const control = "min-h-12 w-full rounded-lg border-2 border-line bg-raised px-2 text-ink";

type Props = { filters: SeasonFilters; fields: string[]; models: { id: string; name: string }[]; onChange: (patch: Partial<SeasonFilters>) => void; onClear: () => void };

/** Date range, task, field, practice/contest and model; each change goes into the address (SeasonClient). An emptied control drops its filter. */
export function SeasonFilterBar({ filters, fields, models, onChange, onClear }: Props) {
  const set = (key: keyof SeasonFilters, value: string) =>
    onChange({ [key]: key === "kind" ? (value || "all") : value === "" ? undefined : value } as Partial<SeasonFilters>);
  const filtered = Boolean(filters.from || filters.to || filters.task || filters.field || filters.kind !== "all" || filters.model);
  return (
    <form role="search" aria-label="Filter the season" className="space-y-2" onSubmit={(e) => e.preventDefault()}>
      <div className="grid grid-cols-2 gap-2">
        <Labelled id="season-from" label="From">
          <input id="season-from" type="date" value={filters.from ?? ""} onChange={(e) => set("from", e.target.value)} className={`${control} figures`} />
        </Labelled>
        <Labelled id="season-to" label="To">
          <input id="season-to" type="date" value={filters.to ?? ""} onChange={(e) => set("to", e.target.value)} className={`${control} figures`} />
        </Labelled>
      </div>
      <div className="grid grid-cols-3 gap-2">
        <Labelled id="season-task" label="Task">
          <select id="season-task" value={filters.task ?? ""} onChange={(e) => set("task", e.target.value)} className={control}>
            <option value="">All</option>
            {TASKS.map((t) => <option key={t} value={t}>Task {t}</option>)}
            <option value="custom">Custom</option>
          </select>
        </Labelled>
        <Labelled id="season-field" label="Field">
          <select id="season-field" value={filters.field ?? ""} onChange={(e) => set("field", e.target.value)} className={control}>
            <option value="">All</option>
            {filters.field && !fields.includes(filters.field) ? <option value={filters.field}>{filters.field}</option> : null}
            {fields.map((f) => <option key={f} value={f}>{f}</option>)}
          </select>
        </Labelled>
        <Labelled id="season-kind" label="Flown at">
          <select id="season-kind" value={filters.kind} onChange={(e) => set("kind", e.target.value)} className={control}>
            <option value="all">Practice and contests</option>
            <option value="practice">Practice</option>
            <option value="contest">Contests</option>
          </select>
        </Labelled>
      </div>
      <Labelled id="season-model" label="Model">
        <select id="season-model" value={filters.model ?? ""} onChange={(e) => set("model", e.target.value)} className={control}>
          <option value="">All models</option>
          {filters.model && !models.some((m) => m.id === filters.model) ? <option value={filters.model}>A model no longer in the hangar</option> : null}
          {models.map((m) => <option key={m.id} value={m.id}>{m.name}</option>)}
        </select>
      </Labelled>
      {filtered ? (
        <button type="button" onClick={onClear} className="inline-flex min-h-12 items-center font-bold underline">
          Clear the filters
        </button>
      ) : null}
    </form>
  );
}

function Labelled({ id, label, children }: { id: string; label: string; children: React.ReactNode }) {
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-semibold">{label}</label>
      {children}
    </div>
  );
}
