"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useId } from "react";
import { useForm } from "react-hook-form";
import { targetFormSchema, type TargetForm } from "@/lib/field/field-forms";
import { useInstantPress } from "./use-instant-press";

const QUICK = [30, 40, 45, 50, 60, 75, 90, 120, 150, 180, 240, 300];

type Props = {
  laneLabel: string;
  /** Seconds of working time left, to grey out targets that no longer fit. */
  secondsLeft: number | null;
  allowEndCall: boolean;
  onTarget: (targetSec: number, timeStamp: number) => void;
  onEndCall: (timeStamp: number) => void;
};

/**
 * Task E: the pilot's announced target, picked before the launch (F3K.11.5). Shown only
 * while no target is pending: an unreached target cannot be changed. A typed target goes through
 * react-hook-form with the zod resolver: its message beside the field, and bad input calls nothing.
 */
export function TargetPicker({ laneLabel, secondsLeft, allowEndCall, onTarget, onEndCall }: Props) {
  const id = useId();
  const { register, handleSubmit, reset, formState } = useForm<TargetForm>({ resolver: zodResolver(targetFormSchema), defaultValues: { target: "" } });
  const error = formState.errors.target?.message;
  return (
    <fieldset className="space-y-2 rounded-xl border-2 border-ink p-3">
      <legend className="px-1 font-bold">Announced target, {laneLabel}</legend>
      <div className="grid grid-cols-4 gap-2">
        {QUICK.map((s) => (
          <TargetButton key={s} seconds={s} tooLong={secondsLeft !== null && s > secondsLeft} onPress={(t) => onTarget(s, t)} />
        ))}
      </div>
      <form
        className="space-y-1"
        noValidate
        onSubmit={(e) => {
          const timeStamp = e.timeStamp; // the press is the time of record, not when validation ends
          void handleSubmit(({ target }) => {
            onTarget(Number(target), timeStamp);
            reset({ target: "" });
          })(e);
        }}
      >
        <div className="flex items-end gap-2">
          <div className="flex-1">
            <label htmlFor={`${id}-o`} className="block text-sm font-semibold">
              Other target (s)
            </label>
            <input
              id={`${id}-o`}
              inputMode="numeric"
              {...register("target")}
              aria-invalid={error ? true : undefined}
              aria-describedby={error ? `${id}-e` : undefined}
              className="figures min-h-12 w-full rounded-lg border-2 border-line bg-raised px-2 text-lg"
            />
          </div>
          <button type="submit" className="min-h-12 rounded-lg border-2 border-ink px-4 font-bold">
            Call
          </button>
        </div>
        {error ? <p id={`${id}-e`} className="text-sm font-semibold text-danger">{error}</p> : null}
      </form>
      {allowEndCall ? (
        <button type="button" onClick={(e) => onEndCall(e.timeStamp)} className="min-h-12 w-full rounded-lg border-2 border-ink font-bold">
          Call &ldquo;end of working time&rdquo; (one attempt)
        </button>
      ) : null}
    </fieldset>
  );
}

function TargetButton({ seconds, tooLong, onPress }: { seconds: number; tooLong: boolean; onPress: (timeStamp: number) => void }) {
  const press = useInstantPress(onPress);
  return (
    <button type="button" {...press} className={`figures min-h-touch rounded-lg border-2 border-ink text-xl font-bold ${tooLong ? "border-dashed" : ""}`}>
      {seconds}
      <span className="sr-only"> seconds{tooLong ? ", longer than the time left" : ""}</span>
    </button>
  );
}
