"use client";

import { useSessionState } from "@/components/auth/session-state";
import { useLocalProfile } from "@/components/sync/use-local-profile";
import { fieldProfileOf, type FieldProfile } from "@/lib/offline/field-profile";

export type { FieldProfile };

/**
 * The signed-in pilot as the field screens need it (owner of new sessions): the session's user once the server
 * answered, else the profile the account check keeps on the device, so the field works with no signal.
 */
export function useFieldProfile(): { profile: FieldProfile | null; loading: boolean } {
  return fieldProfileOf(useLocalProfile(), useSessionState());
}
