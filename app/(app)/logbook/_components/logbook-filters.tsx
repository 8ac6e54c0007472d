"use client";

import { anyFilter, filtersQuery, type LogbookFilters } from "@/lib/field/logbook-filter";

type Props = {
  filters: LogbookFilters;
  onChange: (next: LogbookFilters) => void;
  pilots: string[];
  tasks: { key: string; title: string }[];
  fields: string[];
  /** The session's label when the view is one session (from home's cards). */
  sessionLabel: string | null;
};

const select = "min-h-12 w-full rounded-lg border-2 border-line bg-raised px-2 text-ink";

/** Pilot, task, field and date filters; each change goes into the address (see LogbookList). */
export function LogbookFilterBar({ filters, onChange, pilots, tasks, fields, sessionLabel }: Props) {
  const set = (patch: Partial<LogbookFilters>) => onChange({ ...filters, ...patch });
  return (
    <form role="search" aria-label="Filter the logbook" className="space-y-2" onSubmit={(e) => e.preventDefault()}>
      <div className="grid grid-cols-3 gap-2">
        <Choice id="filter-pilot" label="Pilot" value={filters.pilot} onChange={(pilot) => set({ pilot })} options={pilots.map((p) => [p, p])} />
        <Choice id="filter-task" label="Task" value={filters.task} onChange={(task) => set({ task })} options={tasks.map((t) => [t.key, t.title])} />
        <Choice id="filter-field" label="Field" value={filters.field} onChange={(field) => set({ field })} options={fields.map((f) => [f, f])} />
      </div>
      <div className="grid grid-cols-2 gap-2">
        <DateInput id="filter-from" label="From" value={filters.from} onChange={(from) => set({ from })} />
        <DateInput id="filter-to" label="To" value={filters.to} onChange={(to) => set({ to })} />
      </div>
      {sessionLabel ? <p className="text-sm font-semibold">One session: {sessionLabel}</p> : null}
      {anyFilter(filters) ? (
        <a href="/logbook" onClick={(e) => { e.preventDefault(); onChange({ pilot: "", task: "", field: "", from: "", to: "", session: "" }); }} className="inline-flex min-h-12 items-center font-bold underline">
          Clear the filters
        </a>
      ) : null}
      <p className="sr-only" aria-live="polite">{filtersQuery(filters) ? "Filtered" : ""}</p>
    </form>
  );
}

function Choice({ id, label, value, onChange, options }: { id: string; label: string; value: string; onChange: (v: string) => void; options: [string, string][] }) {
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-semibold">{label}</label>
      <select id={id} value={value} onChange={(e) => onChange(e.target.value)} className={select}>
        <option value="">All</option>
        {value && !options.some(([v]) => v === value) ? <option value={value}>{value}</option> : null}
        {options.map(([v, text]) => <option key={v} value={v}>{text}</option>)}
      </select>
    </div>
  );
}

function DateInput({ id, label, value, onChange }: { id: string; label: string; value: string; onChange: (v: string) => void }) {
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-semibold">{label}</label>
      <input id={id} type="date" value={value} onChange={(e) => onChange(e.target.value)} className={`${select} figures`} />
    </div>
  );
}
