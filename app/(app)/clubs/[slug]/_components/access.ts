import "server-only";
import { notFound, redirect } from "next/navigation";
import { requireClubRole, type ClubAccess } from "@/lib/auth/session";
import { AppError, UnauthorizedError } from "@/lib/errors";
import { clubRef } from "@/lib/validations/clubs";

/**
 * The club page's guard, the same check as every club route (requireClubRole): signed out → the
 * sign-in page (and back here after), not a member or no such club → the same 404 page.
 */
export async function clubPageAccess(slug: string): Promise<ClubAccess> {
  try {
    return await requireClubRole(clubRef({ slug }), "member");
  } catch (error) {
    if (error instanceof UnauthorizedError) redirect(`/sign-in?next=${encodeURIComponent(`/clubs/${slug}`)}`);
    if (error instanceof AppError && (error.status === 404 || error.status === 403)) notFound();
    throw error;
  }
}
