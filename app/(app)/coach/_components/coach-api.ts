"use client";

import type { PilotGrantRow, RosterPilot } from "@/lib/coach/types";

export type { PilotGrantRow, RosterPilot };

export { coachKeys } from "./coach-keys";
