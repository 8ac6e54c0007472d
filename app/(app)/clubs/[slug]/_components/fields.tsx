import { FieldNoteList, FieldPosition } from "@/components/clubs/field-notes";
import { db } from "@/db";
import { listClubFields } from "@/db/queries/club-fields";
import type { ClubAccess } from "@/lib/auth/session";
import { ActionButton } from "./action-button";
import { AddFieldForm } from "./add-field-form";

/**
 * The club's fields with their notes, shown as cautions (and on the Field screen's set-up form to
 * every member who names the field there). Officers add and remove fields.
 */
export async function Fields({ access }: { access: ClubAccess }) {
  const { club } = access;
  const runsClub = access.clubRole === "officer" || access.role === "admin";
  const fields = await listClubFields(db, club.id);
  return (
    <section aria-labelledby="fields" className="space-y-3">
      <h2 id="fields" className="text-lg font-bold">
        Fields
      </h2>
      {fields.length === 0 ? <p className="text-muted">No fields yet{runsClub ? ": add the ones the club flies at." : "."}</p> : null}
      <ul className="space-y-3" aria-label="Fields">
        {fields.map((f) => (
          <li key={f.id} className="card space-y-2 rounded-xl border border-line bg-raised p-4" aria-label={f.name}>
            <div className="flex flex-wrap items-start justify-between gap-2">
              <div>
                <h3 className="font-bold">{f.name}</h3>
                <FieldPosition field={f} />
              </div>
              {runsClub ? <ActionButton method="DELETE" url={`/api/clubs/${club.slug}/fields/${f.id}`} label={`Remove ${f.name}`} confirm={`Remove the field ${f.name}?`} /> : null}
            </div>
            <FieldNoteList field={f} />
          </li>
        ))}
      </ul>
      <p className="text-sm">
        These notes sit beside the{" "}
        <a href="/cautions" className="underline">
          usual safety cautions
        </a>
        ; the field&apos;s own rules and your country&apos;s law come first.
      </p>
      {runsClub ? (
        <details className="space-y-3">
          <summary className="min-h-12 cursor-pointer py-2 font-bold">Add a field</summary>
          <AddFieldForm slug={club.slug} />
        </details>
      ) : null}
    </section>
  );
}
