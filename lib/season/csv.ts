import Papa from "papaparse";
import type { SeasonFlightRow, SeasonRunRow } from "./types";

/**
 * The season's CSV exports (README "Season exports"): a header row, times in seconds with one
 * decimal, instants as ISO 8601 with an explicit offset (UTC, "+00:00"), shares with four decimals.
 */

/** Tenths of a second as seconds with one decimal ("" for none). */
export const seconds = (tenths: number | null): string => (tenths === null ? "" : (tenths / 10).toFixed(1));

/** An instant as ISO 8601 with its offset written out: 2026-03-07T11:59:00.000+00:00. */
export const isoWithOffset = (iso: string): string => new Date(iso).toISOString().replace("Z", "+00:00");

const share = (s: number | null): string => (s === null ? "" : s.toFixed(4));

export const RUN_COLUMNS = [
  "run_id", "lane", "date", "field", "task", "result_s", "max_s", "share", "flights", "lost_s", "penalty_points", "contest",
] as const;

export const FLIGHT_COLUMNS = [
  "run_id", "lane", "date", "field", "task", "flight", "launch_s", "landing_s", "duration_s", "credited_s", "target_s", "status", "turnaround_s",
] as const;

/** One run (lane) as its CSV row, in RUN_COLUMNS order. */
export function runCells(r: SeasonRunRow): string[] {
  return [
    r.runId, String(r.lane), isoWithOffset(r.at), r.field, r.task, seconds(r.resultTenths), seconds(r.maxTenths), share(r.share),
    String(r.flights), seconds(r.lostTenths), String(r.penaltyPoints), r.contest ? "contest" : "practice",
  ];
}

/** One flight as its CSV row, in FLIGHT_COLUMNS order. */
export function flightCells(f: SeasonFlightRow): string[] {
  return [
    f.runId, String(f.lane), isoWithOffset(f.at), f.field, f.task, String(f.flight), seconds(f.launchTenths), seconds(f.landTenths),
    seconds(f.durationTenths), seconds(f.creditedTenths), f.targetSec === null ? "" : f.targetSec.toFixed(1), f.status, seconds(f.turnaroundTenths),
  ];
}

/**
 * The CSV text (RFC 4180, CRLF line ends) of a header and rows. A cell a spreadsheet would take
 * for a formula (a field named "=…") is prefixed with an apostrophe.
 */
export function toCsv(header: readonly string[], rows: readonly string[][]): string {
  return Papa.unparse({ fields: [...header], data: rows.map((r) => [...r]) }, { newline: "\r\n", escapeFormulae: /^[=+@\t\r]/ });
}
