"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useId } from "react";
import { useForm } from "react-hook-form";
import type { PenaltyCause, ReflightCause, ReflightPlacement } from "@/lib/events/schema";
import { PENALTY_CAUSES, REFLIGHT_CAUSES, REFLIGHT_PLACEMENTS } from "@/lib/events/schema";
import { penaltyFormSchema, reflightFormSchema, type PenaltyForm, type ReflightForm } from "@/lib/field/field-forms";
import { PENALTY_CAUSE_WORDS, REFLIGHT_CAUSE_WORDS, REFLIGHT_PLACEMENT_WORDS } from "@/lib/field/ruling-words";

export type PenaltyInput = { points: number; reason: string; cause: PenaltyCause; launchId?: string; midAir?: boolean };
export type RulingActions = {
  onPenalty: (p: PenaltyInput) => Promise<boolean>;
  onUnsigned: () => Promise<boolean>;
  onReflight: (cause: ReflightCause, placement: ReflightPlacement) => Promise<boolean>;
};
type Props = RulingActions & { laneLabel: string; flights: readonly { index: number; launchId: string }[]; onDone: () => void };

const field = "min-h-12 w-full rounded-lg border-2 border-line bg-raised px-2";

/** A message tied to its field (aria-describedby), in plain words. */
function FieldMessage({ id, message }: { id: string; message: string | undefined }) {
  return message ? <p id={id} className="text-sm font-semibold text-danger">{message}</p> : null;
}

/**
 * A penalty (what happened, in which flight, mid-air or not), "not signed", or a re-flight: each
 * one new event. The forms use react-hook-form with the zod resolver (lib/field/field-forms.ts):
 * a message beside the field, and bad input records nothing.
 */
export function RulingForm({ laneLabel, flights, onPenalty, onUnsigned, onReflight, onDone }: Props) {
  const id = useId();
  const last = flights[flights.length - 1];
  const penalty = useForm<PenaltyForm>({
    resolver: zodResolver(penaltyFormSchema),
    defaultValues: { cause: "object-in-safety-area", points: "100", launchId: last?.launchId ?? "", midAir: false, reason: "" },
  });
  const reflight = useForm<ReflightForm>({ resolver: zodResolver(reflightFormSchema), defaultValues: { cause: "organiser", placement: "later-group" } });
  const fe = penalty.formState.errors;
  const described = (name: "p" | "r", error: unknown) => (error ? { "aria-invalid": true as const, "aria-describedby": `${id}-${name}-e` } : {});
  const causeField = penalty.register("cause", {
    onChange: (e: { target: { value: string } }) => {
      const preset = PENALTY_CAUSE_WORDS[e.target.value as PenaltyCause].points;
      if (preset !== null) penalty.setValue("points", String(preset), { shouldValidate: penalty.formState.isSubmitted });
    },
  });
  const addPenalty = async ({ cause, points, launchId, midAir, reason }: PenaltyForm) => {
    const words = reason.trim() || PENALTY_CAUSE_WORDS[cause].label;
    if (await onPenalty({ points: Number(points), reason: words.slice(0, 200), cause, ...(launchId ? { launchId } : {}), ...(midAir ? { midAir } : {}) })) onDone();
  };
  return (
    <div className="space-y-3 rounded-lg bg-surface p-3">
      <form className="space-y-2" aria-label={`Penalty, ${laneLabel}`} noValidate onSubmit={(e) => void penalty.handleSubmit(addPenalty)(e)}>
        <label htmlFor={`${id}-c`} className="block text-sm font-semibold">What happened</label>
        <select id={`${id}-c`} {...causeField} className={field}>
          {PENALTY_CAUSES.map((c) => (
            <option key={c} value={c}>{PENALTY_CAUSE_WORDS[c].label}</option>
          ))}
        </select>
        <div className="flex gap-2">
          <div className="w-24">
            <label htmlFor={`${id}-p`} className="block text-sm font-semibold">Points</label>
            <input id={`${id}-p`} inputMode="numeric" {...penalty.register("points")} {...described("p", fe.points)} className={`figures text-lg ${field}`} />
          </div>
          <div className="flex-1">
            <label htmlFor={`${id}-f`} className="block text-sm font-semibold">In which flight</label>
            <select id={`${id}-f`} {...penalty.register("launchId")} className={field}>
              {flights.map((f) => (
                <option key={f.launchId} value={f.launchId}>Flight {f.index + 1}</option>
              ))}
              <option value="">Not during a flight</option>
            </select>
          </div>
        </div>
        <FieldMessage id={`${id}-p-e`} message={fe.points?.message} />
        <label className="flex min-h-12 items-center gap-3">
          <input type="checkbox" {...penalty.register("midAir")} className="h-6 w-6" />
          <span>Caused by a mid-air collision (no penalty, F3K.4.3)</span>
        </label>
        <label htmlFor={`${id}-r`} className="block text-sm font-semibold">Details (needed for “something else”)</label>
        <input id={`${id}-r`} maxLength={200} {...penalty.register("reason")} {...described("r", fe.reason)} className={field} />
        <FieldMessage id={`${id}-r-e`} message={fe.reason?.message} />
        <button type="submit" className="min-h-12 w-full rounded-lg border-2 border-danger font-bold text-danger">Add penalty</button>
      </form>
      <button type="button" onClick={async () => (await onUnsigned()) && onDone()} className="min-h-12 w-full rounded-lg border-2 border-danger font-bold text-danger">
        Result not signed: round scores zero<span className="sr-only">, {laneLabel}</span>
      </button>
      <form
        className="space-y-2"
        aria-label={`Re-flight, ${laneLabel}`}
        noValidate
        onSubmit={(e) => void reflight.handleSubmit(async ({ cause, placement }) => (await onReflight(cause, placement)) && onDone())(e)}
      >
        <label htmlFor={`${id}-rc`} className="block text-sm font-semibold">Re-flight because of</label>
        <select id={`${id}-rc`} {...reflight.register("cause")} className={field}>
          {REFLIGHT_CAUSES.map((c) => (
            <option key={c} value={c}>{REFLIGHT_CAUSE_WORDS[c]}</option>
          ))}
        </select>
        <label htmlFor={`${id}-rp`} className="block text-sm font-semibold">Flown</label>
        <select id={`${id}-rp`} {...reflight.register("placement")} className={field}>
          {REFLIGHT_PLACEMENTS.map((p) => (
            <option key={p} value={p}>{REFLIGHT_PLACEMENT_WORDS[p].label}</option>
          ))}
        </select>
        <button type="submit" className="min-h-12 w-full rounded-lg border-2 border-ink font-bold">Grant a re-flight</button>
      </form>
    </div>
  );
}
