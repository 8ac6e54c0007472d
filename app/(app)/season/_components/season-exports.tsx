import { exportHref } from "./season-queries";

const link = "inline-flex min-h-12 items-center font-bold underline";

/** CSV downloads of the runs and flights within the filters, and (for the pilot) everything the account holds, as JSON. */
export function SeasonExports({ pilotId, filters, own }: { pilotId: string; filters: string; own: boolean }) {
  return (
    <section aria-labelledby="season-exports" className="space-y-1">
      <h2 id="season-exports" className="text-lg font-bold">Export</h2>
      <p className="text-sm text-muted">Within the filters above; times in seconds, dates in UTC. The README lists the columns.</p>
      <ul>
        <li><a href={exportHref(pilotId, "runs", filters)} download className={link}>Runs as CSV</a></li>
        <li><a href={exportHref(pilotId, "flights", filters)} download className={link}>Flights as CSV</a></li>
        {own ? <li><a href="/api/account/export" download className={link}>All my data as JSON</a></li> : null}
      </ul>
    </section>
  );
}
