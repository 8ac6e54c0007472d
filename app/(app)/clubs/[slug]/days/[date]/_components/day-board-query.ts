import { queryOptions } from "@tanstack/react-query";
import type { DayBoardView } from "@/lib/days/board";

export const dayBoardKey = (slug: string, day: string) => ["day-board", slug, day] as const;

/** A failed request, with its status (lib/query retries neither 401 nor 403). */
export class DayBoardError extends Error {
  constructor(readonly status: number, message: string) {
    super(message);
  }
}

export const dayBoardQuery = (slug: string, day: string) =>
  queryOptions({
    queryKey: dayBoardKey(slug, day),
    queryFn: async (): Promise<DayBoardView> => {
      const res = await fetch(`/api/clubs/${encodeURIComponent(slug)}/days/${day}`, { cache: "no-store", headers: { accept: "application/json" } });
      if (!res.ok) {
        const body = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
        throw new DayBoardError(res.status, body?.error?.message ?? `The server answered ${res.status}.`);
      }
      return (await res.json()) as DayBoardView;
    },
  });
