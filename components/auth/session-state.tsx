"use client";

import { createContext, useContext, useEffect, useState, type ReactNode } from "react";
import { readSessionUser, type SessionUser } from "@/lib/security/session-user";

/**
 * Who is signed in, as next-auth's own session endpoint says, read once per page load — without
 * next-auth's client library, which every signed-in page would otherwise carry in its first load
 * (issue #10). No answer (no signal) reads as signed out, as next-auth's client does; when the
 * signal returns, it asks again, so a page opened offline learns who is timing.
 */
export type SessionState = { status: "loading" | "authenticated" | "unauthenticated"; user: SessionUser | null };

const SessionStateContext = createContext<SessionState>({ status: "loading", user: null });

export function SessionStateProvider({ children }: { children: ReactNode }) {
  const [state, setState] = useState<SessionState>({ status: "loading", user: null });
  useEffect(() => {
    let live = true;
    const ask = () =>
      fetch("/api/auth/session", { cache: "no-store" })
        .then((r) => (r.ok ? r.json() : null))
        .then(readSessionUser, () => null)
        .then((user) => {
          if (live) setState(user ? { status: "authenticated", user } : { status: "unauthenticated", user: null });
        });
    void ask();
    const onOnline = () => void ask();
    window.addEventListener("online", onOnline);
    return () => {
      live = false;
      window.removeEventListener("online", onOnline);
    };
  }, []);
  return <SessionStateContext.Provider value={state}>{children}</SessionStateContext.Provider>;
}

/** The signed-in user of this page (status "loading" until the session endpoint answered). */
export function useSessionState(): SessionState {
  return useContext(SessionStateContext);
}
