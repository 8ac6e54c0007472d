import { ZodError } from "zod";
import type { RunEntity, SessionEntity } from "@/lib/events/entities";
import { buildCustomTask, getCatalogueTask, type CustomTaskInput, type TaskDefinition, type TaskLetter } from "@/lib/tasks";

/** Who flies in the window: the signed-in pilot alone, a partner timed by them, or a group. */
export type WhoFlies = { mode: "me" } | { mode: "partner"; name: string } | { mode: "group"; names: string[] };

export type TaskChoice = { source: "catalogue"; letter: TaskLetter; variant: number } | { source: "custom"; input: CustomTaskInput };

/** The set-up form as typed (numbers still text, so a bad entry can be named). */
export type NewWindowValues = {
  fieldName: string;
  position: { lat: number; lon: number } | null;
  windMs: string;
  gustMs: string;
  temperatureC: string;
  notes: string;
  who: WhoFlies;
  task: TaskChoice;
  prepMin: string;
  noFly: boolean;
};

export type NewWindowPlan = {
  session: Omit<SessionEntity, "id">;
  run: Omit<RunEntity, "id" | "sessionId">;
  task: TaskDefinition;
  prep: { prepSec: number; noFlySec: number } | null;
};

export type NewWindowErrors = Partial<Record<"fieldName" | "windMs" | "gustMs" | "temperatureC" | "who" | "task" | "prepMin", string>>;

export const MAX_LANES = 4;

function optionalNumber(text: string, min: number, max: number): number | undefined | "bad" {
  const t = text.trim().replace(",", ".");
  if (t === "") return undefined;
  const n = Number(t);
  return Number.isFinite(n) && n >= min && n <= max ? n : "bad";
}

/**
 * Checks the set-up form and turns it into the session, the run and the countdown plan;
 * or says, field by field, what to fix (custom-task problems come from the task schema).
 */
export function planNewWindow(
  values: NewWindowValues,
  profile: { id: string; name: string },
  wallNow: number,
  mates: readonly ClubMate[] = [],
): { ok: true; plan: NewWindowPlan } | { ok: false; errors: NewWindowErrors } {
  const errors: NewWindowErrors = {};
  const fieldName = values.fieldName.trim();
  if (!fieldName) errors.fieldName = "Name the field (e.g. the meadow you fly at).";
  else if (fieldName.length > 120) errors.fieldName = "Keep the field name under 120 characters.";
  const windMs = optionalNumber(values.windMs, 0, 60);
  if (windMs === "bad") errors.windMs = "Wind is a number of m/s from 0 to 60.";
  const gustMs = optionalNumber(values.gustMs, 0, 80);
  if (gustMs === "bad") errors.gustMs = "Gusts are a number of m/s from 0 to 80.";
  const temperatureC = optionalNumber(values.temperatureC, -50, 60);
  if (temperatureC === "bad") errors.temperatureC = "Temperature is a number of °C from −50 to 60.";
  const prepMin = optionalNumber(values.prepMin, 0, 60);
  if (prepMin === "bad") errors.prepMin = "Preparation is a number of minutes from 0 to 60.";

  const lanes = lanesFor(values.who, profile, mates);
  if (typeof lanes === "string") errors.who = lanes;

  let task: TaskDefinition | null = null;
  try {
    task = values.task.source === "catalogue" ? getCatalogueTask(values.task.letter, values.task.variant) : buildCustomTask(values.task.input);
  } catch (e) {
    errors.task = e instanceof ZodError ? e.issues.map((i) => i.message).join(" ") : e instanceof Error ? e.message : "This task cannot be built.";
  }
  if (Object.keys(errors).length > 0 || !task || typeof lanes === "string") return { ok: false, errors };

  const conditions = {
    ...(windMs !== undefined && windMs !== "bad" ? { windMs } : {}),
    ...(gustMs !== undefined && gustMs !== "bad" ? { gustMs } : {}),
    ...(temperatureC !== undefined && temperatureC !== "bad" ? { temperatureC } : {}),
    ...(values.notes.trim() ? { notes: values.notes.trim().slice(0, 2000) } : {}),
  };
  const prepSec = prepMin === undefined || prepMin === "bad" ? 0 : Math.round(prepMin * 60);
  const noFlySec = values.noFly ? 60 : 0;
  return {
    ok: true,
    plan: {
      session: { ownerId: profile.id, fieldName, ...(values.position ? { position: values.position } : {}), conditions, startedAtWallMs: wallNow },
      run: { task: task as unknown as Record<string, unknown>, lanes, createdAtWallMs: wallNow },
      task,
      prep: prepSec + noFlySec > 0 ? { prepSec, noFlySec } : null,
    },
  };
}

/** Someone who shares a club with the user (kept on the device for offline set-up). */
export type ClubMate = { id: string; name: string };

/**
 * The club mate a typed name stands for: the one whose name it is (ignoring case and outer
 * spaces), or null when none or several have that name — then the pilot is timed as a guest.
 */
export function matchMate(name: string, mates: readonly ClubMate[]): ClubMate | null {
  const key = name.trim().toLocaleLowerCase();
  if (!key) return null;
  const hits = mates.filter((m) => m.name.trim().toLocaleLowerCase() === key);
  return hits.length === 1 ? hits[0]! : null;
}

/**
 * The run's lanes for who flies; a message when the names do not make a lane. A name that is
 * a club mate's links the lane to their account, so the run reaches their logbook too.
 */
export function lanesFor(who: WhoFlies, profile: { id: string; name: string }, mates: readonly ClubMate[] = []): RunEntity["lanes"] | string {
  if (who.mode === "me") return [{ lane: 0, pilotName: profile.name || "Me", pilotUserId: profile.id }];
  const names = (who.mode === "partner" ? [who.name] : who.names).map((n) => n.trim()).filter(Boolean);
  if (names.length === 0) return who.mode === "partner" ? "Give your partner's name." : "Give at least one pilot's name.";
  if (names.length > MAX_LANES) return `One window times at most ${MAX_LANES} pilots.`;
  if (names.some((n) => n.length > 120)) return "Keep each name under 120 characters.";
  return names.map((pilotName, lane) => {
    const mate = matchMate(pilotName, mates);
    return mate ? { lane, pilotName: mate.name, pilotUserId: mate.id } : { lane, pilotName };
  });
}
