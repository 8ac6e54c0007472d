"use client";

import { SessionProvider, useSession } from "next-auth/react";
import { useEffect } from "react";

/** Who is signed in, as the sync provider needs it. */
export type SessionSeen = {
  status: "loading" | "authenticated" | "unauthenticated";
  user: { id: string; name: string | null; email: string | null } | null;
};

/**
 * next-auth's session, reported to the sync provider. Loaded after first paint (sync-provider.tsx)
 * and rendered beside the page, not around it: no screen waits for next-auth's client code.
 */
export default function SessionWatch({ onChange }: { onChange: (seen: SessionSeen) => void }) {
  return (
    <SessionProvider refetchOnWindowFocus={false}>
      <Report onChange={onChange} />
    </SessionProvider>
  );
}

function Report({ onChange }: { onChange: (seen: SessionSeen) => void }) {
  const { data, status } = useSession();
  const id = data?.user?.id;
  const name = data?.user?.name ?? null;
  const email = data?.user?.email ?? null;
  useEffect(() => {
    onChange({ status, user: id ? { id, name, email } : null });
  }, [onChange, status, id, name, email]);
  return null;
}
