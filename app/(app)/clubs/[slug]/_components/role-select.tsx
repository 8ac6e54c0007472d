"use client";

import { useState } from "react";
import { CLUB_ROLES } from "@/lib/validations/clubs";
import { ROLE_LABEL, type ClubRole } from "@/lib/clubs/roles";
import { useSend } from "@/components/request/use-send";
import { InlineError } from "@/components/ui/form-footer";

/** An officer's choice of a member's role; the change is sent at once and refused with a sentence (e.g. the last officer). */
export function RoleSelect({ slug, userId, name, role }: { slug: string; userId: string; name: string; role: ClubRole }) {
  const { send, error } = useSend();
  const [value, setValue] = useState(role);

  // the choice shows at once and goes back if the server refuses it
  async function change(next: ClubRole) {
    setValue(next);
    const reply = await send("PATCH", `/api/clubs/${slug}/members/${userId}`, { role: next });
    if (reply && !reply.ok) setValue(role);
  }

  return (
    <span className="inline-flex flex-col gap-1">
      <label className="sr-only" htmlFor={`role-${userId}`}>
        Role of {name}
      </label>
      <select id={`role-${userId}`} value={value} onChange={(e) => void change(e.target.value as ClubRole)} className="min-h-12 rounded-lg border-2 border-line bg-raised px-2">
        {CLUB_ROLES.map((r) => (
          <option key={r} value={r}>
            {ROLE_LABEL[r]}
          </option>
        ))}
      </select>
      <InlineError message={error} />
    </span>
  );
}
