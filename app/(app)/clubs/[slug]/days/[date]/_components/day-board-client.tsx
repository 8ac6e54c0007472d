"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { InlineError } from "@/components/ui/form-footer";
import type { DayBoardView } from "@/lib/days/board";
import { secondsText, taskText } from "../../../../../season/_components/season-format";
import { sendJson } from "@/components/request/json";
import { dayTitle, momentText, offsetText, timeText, uncertaintyText } from "./day-format";
import { dayBoardKey, dayBoardQuery } from "./day-board-query";
import { Differences } from "./differences";
import { LiftStrip } from "./lift-strip";
import { ScrollRegion } from "@/components/ui/scroll-region";

type Props = { slug: string; clubName: string; day: string; canClose: boolean };

const card = "card rounded-xl border border-line bg-raised p-3";

/** The Day board: the day's runs on one timeline, best results, leaders, who timed whom, clocks, disagreements, the lift timeline. */
export function DayBoardClient({ slug, clubName, day, canClose }: Props) {
  const query = useQuery(dayBoardQuery(slug, day));
  if (query.isError) return <p role="alert">{query.error.message}</p>;
  if (!query.data) return <p aria-busy="true">Loading the Day board…</p>;
  const board = query.data;
  const name = (id: string) => board.people[id] ?? "someone outside the club";
  return (
    <div className="space-y-8">
      <header className="space-y-1">
        <p>
          <Link className="underline" href={`/clubs/${slug}`}>
            {clubName}
          </Link>
        </p>
        <h1 className="text-2xl font-extrabold">Field day, {dayTitle(day)}</h1>
        <p className="text-muted">
          {board.fields.map((f) => f.name).join(", ")} · times in {board.timeZone}, on the corrected clock
        </p>
        {board.closedAt ? (
          <p data-testid="day-closed">
            Closed on {momentText(board.closedAt, board.timeZone)}
            {board.closedBy ? ` by ${name(board.closedBy)}` : ""}: its runs are final; phones that sync later change nothing here.
          </p>
        ) : null}
        {canClose ? <CloseDay slug={slug} day={day} closed={board.closedAt !== null} /> : null}
      </header>
      <Timeline board={board} name={name} />
      <Best board={board} name={name} />
      <Leaders board={board} name={name} />
      <Timed board={board} name={name} />
      <Clocks board={board} name={name} />
      <Differences board={board} name={name} slug={slug} canDecide={canClose} />
      <LiftStrip bins={board.lift} timeZone={board.timeZone} />
    </div>
  );
}

type Part = { board: DayBoardView; name: (id: string) => string };

function CloseDay({ slug, day, closed }: { slug: string; day: string; closed: boolean }) {
  const client = useQueryClient();
  const [note, setNote] = useState<string | null>(null);
  const close = useMutation({
    mutationFn: async () => {
      const reply = await sendJson<{ summaries: number }>("POST", `/api/clubs/${slug}/days/${day}/close`);
      if (!reply.ok) throw new Error(reply.message);
      return reply.data;
    },
    onSuccess: async (data) => {
      setNote(data.summaries > 0 ? `Closed. The summary goes to ${data.summaries} ${data.summaries === 1 ? "member" : "members"} who asked for it.` : "Closed.");
      await client.invalidateQueries({ queryKey: dayBoardKey(slug, day) });
    },
  });
  if (closed) return <p role="status">{note ?? "Its summary was sent to the members who asked for it."}</p>;
  return (
    <div className="space-y-1">
      <button type="button" onClick={() => close.mutate()} disabled={close.isPending} className="min-h-12 rounded-lg border-2 border-ink px-3 font-bold disabled:opacity-50">
        {close.isPending ? "Closing…" : "Close the day and send the summary"}
      </button>
      <InlineError message={close.error?.message} />
    </div>
  );
}

function Timeline({ board, name }: Part) {
  const first = board.runs[0]?.startMs ?? 0;
  const span = Math.max(1, (board.runs[board.runs.length - 1]?.startMs ?? first) - first);
  return (
    <section aria-labelledby="timeline" className="space-y-3">
      <h2 id="timeline" className="text-lg font-bold">
        Runs of the day
      </h2>
      {board.runs.length === 0 ? (
        <p className="text-muted">No runs yet: members&apos; runs come in when their phones sync.</p>
      ) : (
        <>
          <div aria-hidden="true" className="relative h-6 rounded-full bg-line/40">
            {board.runs.map((r) => (
              <span key={r.runId} className="absolute top-1 h-4 w-2 rounded-sm bg-ink" style={{ left: `calc(${((r.startMs - first) / span) * 100}% - ${((r.startMs - first) / span) * 8}px)` }} />
            ))}
          </div>
          <ol className="space-y-2" aria-label="Runs of the day">
            {board.runs.map((r) => (
              <li key={r.runId} className={card} data-run-id={r.runId}>
                <p className="font-bold">
                  <time dateTime={new Date(r.startMs).toISOString()}>{timeText(r.startMs, board.timeZone)}</time> · {taskText(r.taskCode)} · {r.fieldName}
                </p>
                <ul className="text-sm">
                  {r.lanes.map((l) => (
                    <li key={l.lane}>
                      {name(l.pilotId)}: {secondsText(l.resultTenths)}, {l.flights.length} {l.flights.length === 1 ? "flight" : "flights"}
                      {l.timedBy !== l.pilotId ? `, timed by ${name(l.timedBy)}` : ", own timing"}
                      {l.pending ? " · not yet accepted by the pilot" : ""}
                      {l.needsReview ? " · needs review" : ""}
                      {l.decided ? " · the record an officer chose for this day" : ""}
                    </li>
                  ))}
                </ul>
              </li>
            ))}
          </ol>
        </>
      )}
    </section>
  );
}

function Table({ caption, head, rows }: { caption: string; head: string[]; rows: (string | number)[][] }) {
  return (
    <ScrollRegion label={caption}>
      <table className="w-full text-left text-sm">
        <caption className="text-left font-semibold">{caption}</caption>
        <thead>
          <tr>
            {head.map((h) => (
              <th key={h} scope="col" className="py-1 pr-3">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((row, i) => (
            <tr key={i} className="border-t border-line">
              {row.map((cell, j) =>
                j === 0 ? (
                  <th key={j} scope="row" className="py-1 pr-3 font-normal">
                    {cell}
                  </th>
                ) : (
                  <td key={j} className="py-1 pr-3">
                    {cell}
                  </td>
                ),
              )}
            </tr>
          ))}
        </tbody>
      </table>
    </ScrollRegion>
  );
}

function Best({ board, name }: Part) {
  if (board.best.length === 0) return null;
  return (
    <section aria-labelledby="best" className="space-y-3">
      <h2 id="best" className="text-lg font-bold">
        Best results per task
      </h2>
      {board.best.map((t) => (
        <Table key={t.taskCode} caption={taskText(t.taskCode)} head={["Pilot", "Best", "Windows"]} rows={t.rows.map((r) => [name(r.pilotId), secondsText(r.resultTenths), r.windows])} />
      ))}
    </section>
  );
}

function Leaders({ board, name }: Part) {
  if (board.flightLeaders.length === 0 && board.turnaroundLeaders.length === 0) return null;
  return (
    <section aria-labelledby="leaders" className="space-y-3">
      <h2 id="leaders" className="text-lg font-bold">
        Leaders
      </h2>
      {board.flightLeaders.length > 0 ? (
        <Table
          caption="Flight time"
          head={["Pilot", "Longest flight", "Time in the air", "Flights"]}
          rows={board.flightLeaders.map((l) => [name(l.pilotId), secondsText(l.longestTenths), secondsText(l.totalTenths), l.flights])}
        />
      ) : null}
      {board.turnaroundLeaders.length > 0 ? (
        <Table
          caption="Turnaround (landing to next launch, median)"
          head={["Pilot", "Median", "Turns"]}
          rows={board.turnaroundLeaders.map((l) => [name(l.pilotId), `${(l.medianGroundMs / 1000).toFixed(1)} s`, l.turns])}
        />
      ) : null}
    </section>
  );
}

function Timed({ board, name }: Part) {
  return (
    <section aria-labelledby="timed" className="space-y-3">
      <h2 id="timed" className="text-lg font-bold">
        Who timed whom
      </h2>
      {board.timed.length === 0 ? (
        <p className="text-muted">Every run so far was timed by its own pilot.</p>
      ) : (
        <ul className="space-y-1" aria-label="Who timed whom">
          {board.timed.map((t) => (
            <li key={`${t.timerId}-${t.pilotId}`}>
              {name(t.timerId)} timed {name(t.pilotId)}: {t.lanes} {t.lanes === 1 ? "window" : "windows"}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

function Clocks({ board, name }: Part) {
  return (
    <section aria-labelledby="clocks" className="space-y-3">
      <h2 id="clocks" className="text-lg font-bold">
        Phone clocks
      </h2>
      <p className="text-sm text-muted">Each phone&apos;s clock against the server&apos;s at its first tap of the day, as the phone measured it; every time on this page is corrected by it.</p>
      <Table
        caption="Clock offsets"
        head={["Phone", "Offset", "Uncertainty"]}
        rows={board.clocks.map((c) => [
          `${name(c.ownerId)}’s phone (${c.deviceId.slice(-6)})`,
          c.offsetMs === null ? "not measured" : offsetText(c.offsetMs),
          c.uncertaintyMs === null ? "—" : uncertaintyText(c.uncertaintyMs),
        ])}
      />
    </section>
  );
}
