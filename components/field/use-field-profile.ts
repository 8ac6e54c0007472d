"use client";

import { useSession } from "next-auth/react";

export type FieldProfile = { id: string; name: string };

/**
 * The signed-in pilot as the field screens need it (owner of new sessions, "who" in the
 * corrections list). Reads the next-auth session for now; when the sync layer's cached
 * profile (`useLocalProfile`) is available, it is used instead so this works with no signal.
 */
export function useFieldProfile(): { profile: FieldProfile | null; loading: boolean } {
  const { data, status } = useSession();
  const user = data?.user as { id?: string; name?: string | null } | undefined;
  if (status === "loading") return { profile: null, loading: true };
  return { profile: user?.id ? { id: user.id, name: user.name ?? "" } : null, loading: false };
}
