import { db } from "@/db";
import { listClubMembers } from "@/db/queries/clubs";
import { listPendingInvitations } from "@/db/queries/club-invitations";
import { ROLE_LABEL } from "@/lib/clubs/roles";
import { formatDate } from "@/lib/format";
import type { ClubAccess } from "@/lib/auth/session";
import { ActionButton } from "./action-button";
import { InviteForm } from "./invite-form";
import { RoleSelect } from "./role-select";

/**
 * Members with their roles. Officers (and site admins) change roles, remove members and invite;
 * everyone can leave. Addresses are shown to officers only.
 */
export async function Members({ access }: { access: ClubAccess }) {
  const { club } = access;
  const runsClub = access.clubRole === "officer" || access.role === "admin";
  const [members, pending] = await Promise.all([listClubMembers(db, club.id), runsClub ? listPendingInvitations(db, club.id) : []]);
  return (
    <section aria-labelledby="members" className="space-y-3">
      <h2 id="members" className="text-lg font-bold">
        Members ({members.length})
      </h2>
      <ul className="space-y-2" aria-label="Members">
        {members.map((m) => (
          <li key={m.userId} className="card flex flex-wrap items-center justify-between gap-3 rounded-xl border border-line bg-raised p-3">
            <span>
              <span className="block font-bold">
                {m.name}
                {m.userId === access.id ? " (you)" : ""}
              </span>
              <span className="text-sm text-muted">
                {runsClub ? `${m.email} · ` : ""}
                {ROLE_LABEL[m.role]}
              </span>
            </span>
            <span className="flex flex-wrap items-start gap-2">
              {runsClub ? <RoleSelect slug={club.slug} userId={m.userId} name={m.name} role={m.role} /> : null}
              {m.userId === access.id ? (
                <ActionButton method="DELETE" url={`/api/clubs/${club.slug}/members/${m.userId}`} label="Leave the club" confirm={`Leave ${club.name}?`} then="/clubs" />
              ) : runsClub ? (
                <ActionButton method="DELETE" url={`/api/clubs/${club.slug}/members/${m.userId}`} label={`Remove ${m.name}`} confirm={`Remove ${m.name} from ${club.name}?`} />
              ) : null}
            </span>
          </li>
        ))}
      </ul>
      {runsClub ? (
        <div className="space-y-3">
          <h3 className="font-bold">Invite someone</h3>
          <InviteForm slug={club.slug} />
          {pending.length > 0 ? (
            <ul aria-label="Invitations not yet used" className="space-y-1 text-sm">
              {pending.map((p) => (
                <li key={p.id} className="flex flex-wrap items-center justify-between gap-2">
                  <span>
                    {p.email} · {ROLE_LABEL[p.role]} · link works until {formatDate(p.expiresAt)}
                  </span>
                  <ActionButton method="DELETE" url={`/api/clubs/${club.slug}/invitations/${p.id}`} label={`Withdraw the invitation to ${p.email}`} confirm={`Withdraw the invitation to ${p.email}? Its link stops working.`} />
                </li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}
    </section>
  );
}
