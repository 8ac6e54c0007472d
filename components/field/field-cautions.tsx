"use client";

import { CautionList } from "@/components/cautions/caution-list";
import { FieldNoteList } from "@/components/clubs/field-notes";
import type { StoredClubField } from "./use-club-fields";

/**
 * The set-up form's cautions for a field one of the pilot's clubs keeps: the field's own notes first,
 * then the usual safety cautions (whose closing line defers to the field's rules and the law).
 */
export function FieldCautions({ field }: { field: StoredClubField }) {
  return (
    <section aria-labelledby="field-cautions-title" className="space-y-3 rounded-2xl border-4 border-ink p-4">
      <h2 id="field-cautions-title" className="text-lg font-extrabold">
        Flying at {field.name}
      </h2>
      <p className="text-sm">
        Notes from {field.clubName}. The field&apos;s own rules and your country&apos;s law come first.
      </p>
      <FieldNoteList field={field} />
      <details>
        <summary className="min-h-12 cursor-pointer py-2 font-bold">The usual safety cautions</summary>
        <CautionList />
      </details>
    </section>
  );
}
