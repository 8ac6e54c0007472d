"use client";

import { useRef, type KeyboardEvent, type MouseEvent, type PointerEvent } from "react";

/**
 * Handlers for a control that acts the instant it is touched (`pointerdown`, not click: a
 * click waits for the finger to lift), passing the input's own timeStamp. Keyboard (Enter /
 * Space) and assistive technology (a click with no pointer, detail 0) press it too; each
 * input presses exactly once, and key repeat is ignored.
 */
export function useInstantPress(onPress: (timeStamp: number) => void, disabled = false) {
  const lastKeyAt = useRef(-Infinity);
  return {
    onPointerDown: (e: PointerEvent<HTMLElement>) => {
      if (disabled || (e.pointerType === "mouse" && e.button !== 0)) return;
      e.preventDefault(); // no focus flash, no text selection, no delayed click
      onPress(e.timeStamp);
    },
    onKeyDown: (e: KeyboardEvent<HTMLElement>) => {
      if (e.key !== "Enter" && e.key !== " ") return;
      e.preventDefault();
      e.stopPropagation(); // the screen-wide clicker handler must not press again
      lastKeyAt.current = e.timeStamp;
      if (!e.repeat && !disabled) onPress(e.timeStamp);
    },
    onClick: (e: MouseEvent<HTMLElement>) => {
      if (disabled || e.detail !== 0 || e.timeStamp - lastKeyAt.current < 1000) return;
      onPress(e.timeStamp);
    },
  };
}
