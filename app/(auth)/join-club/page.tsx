import type { Metadata } from "next";
import Link from "next/link";
import { lookUpInvitation } from "@/lib/auth/club-invitations";
import { INVITATION_LINK_MESSAGES } from "@/lib/auth/link-error";
import { getSessionUser } from "@/lib/auth/session";
import { ROLE_LABEL } from "@/lib/clubs/roles";
import { emailTokenSchema } from "@/lib/validations/email";
import { JoinButton } from "./join-button";

export const metadata: Metadata = { title: "Join a club" };
export const dynamic = "force-dynamic";

/**
 * A club invitation's page: which club and role, then sign in (or create an account) and press Join.
 * Looking does not use the link (a mail scanner that opens it spends nothing); only the button does.
 */
export default async function JoinClubPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const raw = (await searchParams).token;
  const token = emailTokenSchema.safeParse(raw);
  const use = token.success ? await lookUpInvitation(token.data) : ({ status: "unknown" } as const);
  if (use.status !== "ok") {
    return (
      <>
        <h1 className="text-xl font-bold">Join a club</h1>
        <p role="alert" className="font-semibold text-danger">
          {INVITATION_LINK_MESSAGES[use.status]}
        </p>
      </>
    );
  }
  const { clubName, role, email } = use.invitation;
  const here = `/join-club?token=${encodeURIComponent(token.data!)}`;
  const user = await getSessionUser();
  return (
    <>
      <h1 className="text-xl font-bold">Join {clubName}</h1>
      <p>
        You are invited as <strong>{ROLE_LABEL[role].toLowerCase()}</strong>. The invitation was sent to {email}.
      </p>
      {user ? (
        <JoinButton token={token.data!} clubName={clubName} who={`${user.name} (${user.email})`} />
      ) : (
        <div className="space-y-3">
          <p>Sign in to join, or create an account first (with any address).</p>
          <Link href={`/sign-in?next=${encodeURIComponent(here)}`} className="block font-bold underline">
            Sign in to join
          </Link>
          <Link href={`/sign-up?next=${encodeURIComponent(here)}`} className="block font-bold underline">
            Create an account
          </Link>
        </div>
      )}
    </>
  );
}
