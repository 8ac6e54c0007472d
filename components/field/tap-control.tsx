"use client";

import { useInstantPress } from "./use-instant-press";

type Props = {
  /** What a tap records now ("Launch" / "Landed"), the button's visible word. */
  action: string;
  /** Who this control is for, for screen readers ("lane 1, Kit"). */
  laneLabel: string;
  inAir: boolean;
  /** solo: a third of the screen; lane: one lane's panel; board: one cell of the multi-lane board. */
  size: "solo" | "lane" | "board";
  disabled?: boolean;
  /** Called with the input event's own timeStamp (the time of record). */
  onTap: (timeStamp: number) => void;
};

/**
 * The one huge control of a lane, pressed the instant it is touched (useInstantPress), so
 * the stamp is the moment of touch; the arrow shows what a tap records, beside the word.
 */
export function TapControl({ action, laneLabel, inAir, size, disabled, onTap }: Props) {
  const press = useInstantPress(onTap, disabled);
  const height = size === "solo" ? "min-h-[34vh] text-4xl" : size === "lane" ? "min-h-28 text-4xl" : "min-h-20 text-2xl";
  return (
    <button
      type="button"
      disabled={disabled}
      {...press}
      aria-label={`${action}, ${laneLabel}`}
      className={`${height} flex w-full touch-none select-none flex-col items-center justify-center gap-1 rounded-2xl border-4 border-ink font-extrabold disabled:opacity-50 ${
        inAir ? "bg-raised text-ink" : "bg-accent text-accent-ink"
      }`}
    >
      <span aria-hidden className={`${size === "board" ? "text-3xl" : "text-5xl"} leading-none`}>
        {inAir ? "▼" : "▲"}
      </span>
      <span>{action}</span>
    </button>
  );
}
