import "server-only";
import { notFound, redirect } from "next/navigation";
import { requireContestRole } from "@/lib/auth/contest-role";
import { requireClubRole } from "@/lib/auth/session";
import type { ClubRole } from "@/lib/clubs/roles";
import { AppError, UnauthorizedError } from "@/lib/errors";
import { clubRef } from "@/lib/validations/clubs";

/** The contest screens' guard, the routes' check: signed out → sign-in (and back), not allowed or no such thing → 404. */
export async function contestPageAccess(p: { contestId?: string; slug?: string; role: ClubRole; back: string }) {
  try {
    if (p.contestId) return await requireContestRole(p.contestId, p.role);
    return await requireClubRole(clubRef({ slug: p.slug ?? "" }), p.role);
  } catch (error) {
    if (error instanceof UnauthorizedError) redirect(`/sign-in?next=${encodeURIComponent(p.back)}`);
    if (error instanceof AppError && (error.status === 404 || error.status === 403)) notFound();
    throw error;
  }
}
