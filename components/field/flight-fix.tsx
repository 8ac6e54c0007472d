"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useId, useState } from "react";
import { useForm } from "react-hook-form";
import { flightTimeFormSchema, type FlightTimeForm } from "@/lib/field/field-forms";
import { parseFlightTime } from "@/lib/field/flight-fix";
import { formatRunning, secondsText } from "@/lib/field/display";
import type { InvalidReason } from "@/lib/events/schema";

const REASONS: { value: InvalidReason; label: string }[] = [
  { value: "landing-outside-field", label: "Landed outside the field" },
  { value: "part-lost", label: "A part came off in flight" },
  { value: "forbidden-airspace", label: "Did not leave forbidden airspace" },
  { value: "other", label: "Other reason" },
];

type Props = {
  flightNumber: number;
  currentTenths: number | null;
  /** The launch as tenths of working time elapsed (negative before the signal). */
  launchTenths: number;
  onSetTime: (tenths: number) => Promise<unknown>;
  onSetLaunch: (tenths: number) => Promise<string | null>;
  onInvalid: (reason: InvalidReason) => Promise<unknown>;
};

/**
 * Correct a landed flight's time (moves the landing) or its launch (the landing stays), or mark
 * it invalid; each is a new event, nothing is overwritten.
 */
export function FlightFix({ flightNumber, currentTenths, launchTenths, onSetTime, onSetLaunch, onInvalid }: Props) {
  const id = useId();
  const [reason, setReason] = useState<InvalidReason>("landing-outside-field");
  return (
    <div className="mt-2 space-y-3 rounded-lg bg-surface p-3">
      <TimeForm
        label={`Correct time of flight ${flightNumber} (s)`}
        initial={currentTenths === null ? "" : secondsText(currentTenths)}
        submit="Set time"
        onSubmit={async (tenths) => {
          await onSetTime(tenths);
          return null;
        }}
      />
      <TimeForm
        label={`Launch of flight ${flightNumber}, working time elapsed (m:ss.s)`}
        initial={launchTenths < 0 ? "" : formatRunning(launchTenths * 100)}
        submit="Set launch"
        onSubmit={onSetLaunch}
      />
      <div className="flex items-end gap-2">
        <div className="flex-1">
          <label htmlFor={`${id}-r`} className="block text-sm font-semibold">
            Why flight {flightNumber} scores zero
          </label>
          <select
            id={`${id}-r`}
            value={reason}
            onChange={(e) => setReason(e.target.value as InvalidReason)}
            className="min-h-12 w-full rounded-lg border-2 border-line bg-raised px-2"
          >
            {REASONS.map((r) => (
              <option key={r.value} value={r.value}>
                {r.label}
              </option>
            ))}
          </select>
        </div>
        <button type="button" onClick={() => void onInvalid(reason)} className="min-h-12 rounded-lg border-2 border-danger px-3 font-bold text-danger">
          Mark invalid
        </button>
      </div>
    </div>
  );
}

type TimeFormProps = {
  label: string;
  initial: string;
  submit: string;
  /** Resolves to why the time was refused, or null. */
  onSubmit: (tenths: number) => Promise<string | null>;
};

/**
 * One typed time ("63.4" or "1:03.4") with its own message beside the field (react-hook-form with
 * the zod resolver, lib/field/field-forms.ts) for unreadable input, or the reason it was refused.
 * Unreadable input records nothing.
 */
function TimeForm({ label, initial, submit, onSubmit }: TimeFormProps) {
  const id = useId();
  const { register, handleSubmit, setError, formState } = useForm<FlightTimeForm>({ resolver: zodResolver(flightTimeFormSchema), defaultValues: { time: initial } });
  const error = formState.errors.time?.message;
  const save = async ({ time }: FlightTimeForm) => {
    const refused = await onSubmit(parseFlightTime(time)!);
    if (refused) setError("time", { message: refused });
  };
  return (
    <form noValidate onSubmit={(e) => void handleSubmit(save)(e)}>
      <div className="flex items-end gap-2">
        <div className="flex-1">
          <label htmlFor={`${id}-t`} className="block text-sm font-semibold">
            {label}
          </label>
          <input
            id={`${id}-t`}
            inputMode="decimal"
            {...register("time")}
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? `${id}-e` : undefined}
            className="figures min-h-12 w-full rounded-lg border-2 border-line bg-raised px-2 text-lg"
          />
        </div>
        <button type="submit" className="min-h-12 rounded-lg bg-accent px-4 font-bold text-accent-ink">
          {submit}
        </button>
      </div>
      {error ? (
        <p id={`${id}-e`} role="alert" className="mt-1 text-sm font-semibold text-danger">
          {error}
        </p>
      ) : null}
    </form>
  );
}
