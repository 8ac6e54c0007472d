"use client";

import { useLocalProfile } from "@/components/sync/use-local-profile";

export type FieldProfile = { id: string; name: string };

/**
 * The signed-in pilot as the field screens need it (owner of new sessions): the profile the
 * sync layer keeps on the device while online, so the field works with no signal.
 */
export function useFieldProfile(): { profile: FieldProfile | null; loading: boolean } {
  const cached = useLocalProfile();
  return { profile: cached ? { id: cached.id, name: cached.name } : null, loading: cached === undefined };
}
