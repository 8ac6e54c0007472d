import type { ReactNode } from "react";
import { ScrollRegion } from "@/components/ui/scroll-region";

export type TableView = { columns: string[]; rows: (string | number)[][] };

/**
 * One chart of the season: a heading, the drawing (hidden from screen readers, which get the
 * table instead), a plain sentence saying what it shows, and the same numbers as a table.
 */
export function ChartFigure({ id, title, sentence, table, children }: { id: string; title: string; sentence: string; table: TableView; children: ReactNode }) {
  return (
    <figure aria-labelledby={`${id}-title`} data-chart={id} className="space-y-2">
      <h3 id={`${id}-title`} className="font-bold">{title}</h3>
      {table.rows.length === 0 ? (
        <p className="text-muted">Nothing to draw within these filters.</p>
      ) : (
        <div aria-hidden="true" className="h-56 w-full">{children}</div>
      )}
      <figcaption>{sentence}</figcaption>
      <details>
        <summary className="min-h-12 cursor-pointer py-2 font-semibold">Table view: {title.toLowerCase()}</summary>
        <ScrollRegion label={`Table view: ${title.toLowerCase()}`}>
          <table className="figures w-full text-left text-sm">
            <caption className="sr-only">{title}</caption>
            <thead>
              <tr>{table.columns.map((c) => <th key={c} scope="col">{c}</th>)}</tr>
            </thead>
            <tbody>
              {table.rows.map((r, i) => (
                <tr key={i}>{r.map((cell, j) => (j === 0 ? <th key={j} scope="row" className="font-normal">{cell}</th> : <td key={j}>{cell}</td>))}</tr>
              ))}
            </tbody>
          </table>
        </ScrollRegion>
      </details>
    </figure>
  );
}

/** Colours from the theme (globals.css), so each scheme keeps its contrast. */
export const SERIES = ["rgb(var(--air))", "rgb(var(--warn))", "rgb(var(--good))", "rgb(var(--danger))", "rgb(var(--accent))", "rgb(var(--muted))"];
export const INK = "rgb(var(--ink))";
export const AXIS = { stroke: "rgb(var(--muted))", tick: { fill: "rgb(var(--ink))", fontSize: 12 } };
