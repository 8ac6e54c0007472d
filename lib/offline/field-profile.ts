/** Who is timing on this phone, as the field screens need it (the owner of new sessions). */
export type FieldProfile = { id: string; name: string };

type Profile = { id: string; name: string } | null | undefined;
type Session = { status: "loading" | "authenticated" | "unauthenticated"; user: { id: string; name: string } | null };

/**
 * The field's pilot from what the page knows: the signed-in user when the server's session has answered (so a phone
 * that has just signed in can set up a window before the account check has stored the profile on the device), else
 * the profile kept on the device from the last time online (so the field works with no signal). Loading while the
 * device database has not answered, or while neither it nor the session has named anyone yet.
 */
export function fieldProfileOf(cached: Profile, session: Session): { profile: FieldProfile | null; loading: boolean } {
  if (session.status === "authenticated" && session.user) return { profile: { id: session.user.id, name: session.user.name }, loading: false };
  if (cached) return { profile: { id: cached.id, name: cached.name }, loading: false };
  return { profile: null, loading: cached === undefined || session.status === "loading" };
}
