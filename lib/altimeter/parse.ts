import Papa from "papaparse";
import { FEET_TO_M, pressureToHeightM } from "./isa";
import type { LogUploadMapping } from "./mapping";
import type { Sample } from "./series";

/** Why a file was refused, naming the line (1-based, as an editor shows it) and the column. */
export class LogFileError extends Error {
  constructor(message: string, readonly line: number | null, readonly column: number | null) {
    super(message);
  }
}

const MIN_SAMPLES = 10;
const CLOCK = /^(\d{1,2}):(\d{2}):(\d{2}(?:[.,]\d+)?)$/;

/**
 * The samples of an altimeter CSV read with papaparse and the user's mapping. Clock times take
 * their date from `aroundMs` (the run's start): the day that puts them nearest it, so a log
 * across midnight UTC still lands on the right day. Times must not run backwards.
 */
export function parseAltimeterCsv(csv: string, upload: LogUploadMapping, aroundMs: number): Sample[] {
  const { mapping } = upload;
  const parsed = Papa.parse<string[]>(csv, { skipEmptyLines: false, delimiter: "" });
  const fatal = parsed.errors.find((e) => e.type !== "Delimiter");
  if (fatal) throw new LogFileError(`Line ${(fatal.row ?? 0) + 1}: ${fatal.message}.`, (fatal.row ?? 0) + 1, null);
  const samples: Sample[] = [];
  let dayMs: number | null = null;
  parsed.data.forEach((row, index) => {
    const line = index + 1;
    if ((mapping.hasHeader && index === 0) || row.every((c) => c.trim() === "")) return;
    const cell = (column: number, what: string) => {
      const value = row[column - 1]?.trim();
      if (value === undefined || value === "") throw new LogFileError(`Line ${line}, column ${column} (${what}) is empty.`, line, column);
      return value;
    };
    const timeText = cell(mapping.timeColumn, "time");
    let tMs: number;
    if (mapping.timeKind === "seconds") {
      const s = number(timeText, line, mapping.timeColumn, "time");
      tMs = (upload.startAtMs ?? 0) + Math.round(s * 1000);
    } else {
      const m = CLOCK.exec(timeText);
      if (!m) throw new LogFileError(`Line ${line}, column ${mapping.timeColumn} (time): "${short(timeText)}" is not a clock time like 14:03:27.`, line, mapping.timeColumn);
      const ofDay = (Number(m[1]) * 3600 + Number(m[2]) * 60 + Number(m[3]!.replace(",", "."))) * 1000 - mapping.utcOffsetMin * 60_000;
      dayMs ??= nearestDay(ofDay, aroundMs);
      tMs = dayMs + ofDay;
    }
    const value = number(cell(mapping.valueColumn, "height"), line, mapping.valueColumn, mapping.valueKind === "hPa" ? "pressure" : "height");
    if (mapping.valueKind === "hPa" && (value < 100 || value > 1100)) throw new LogFileError(`Line ${line}, column ${mapping.valueColumn} (pressure): ${value} hPa is not an air pressure near the ground.`, line, mapping.valueColumn);
    const hM = mapping.valueKind === "m" ? value : mapping.valueKind === "ft" ? value * FEET_TO_M : pressureToHeightM(value);
    const previous = samples[samples.length - 1];
    if (previous && tMs < previous.tMs) throw new LogFileError(`Line ${line}, column ${mapping.timeColumn} (time): the time runs backwards.`, line, mapping.timeColumn);
    samples.push({ tMs, hM });
  });
  if (samples.length < MIN_SAMPLES) throw new LogFileError(`The file has ${samples.length} samples; a log needs at least ${MIN_SAMPLES}.`, null, null);
  return samples;
}

function number(text: string, line: number, column: number, what: string): number {
  const n = Number(text.replace(",", "."));
  if (!Number.isFinite(n) || Math.abs(n) > 1e7) throw new LogFileError(`Line ${line}, column ${column} (${what}): "${short(text)}" is not a number.`, line, column);
  return n;
}

const short = (s: string) => (s.length > 40 ? `${s.slice(0, 40)}…` : s);

const DAY = 86_400_000;
function nearestDay(ofDayMs: number, aroundMs: number): number {
  const day = Math.floor(aroundMs / DAY) * DAY;
  return [day - DAY, day, day + DAY].reduce((best, d) => (Math.abs(d + ofDayMs - aroundMs) < Math.abs(best + ofDayMs - aroundMs) ? d : best));
}
