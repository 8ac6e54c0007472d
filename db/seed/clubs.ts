import { eq } from "drizzle-orm";
import type { Database } from "../index";
import { clubDays, clubFields, clubs, contests, memberships, users } from "../schema";
import { DEMO_CLUB } from "./demo-people";
import { DEMO_FIELDS, HERONMOOR_COMING, KESTREL_CLUB, KESTREL_PEOPLE } from "./demo-clubs";

/**
 * The clubs part of the demo (idempotent, so a database seeded before clubs had fields gets them):
 * the demo club's fields with their cautions and its coming day and contest, and the second club
 * with its officer, coach, members and field. Runs after seedDemo made the demo club.
 */
export async function seedClubs(db: Database, passwordHash: () => Promise<string>): Promise<void> {
  const [kestrel] = await db.select({ id: clubs.id }).from(clubs).where(eq(clubs.slug, KESTREL_CLUB.slug));
  if (kestrel) return;
  const hash = await passwordHash();
  await db.transaction(async (tx) => {
    const [heronmoor] = await tx.select({ id: clubs.id }).from(clubs).where(eq(clubs.slug, DEMO_CLUB.slug));
    const [officer] = await tx.select({ id: users.id }).from(users).where(eq(users.email, "ines@example.com"));
    if (heronmoor) {
      const fields = await tx
        .insert(clubFields).values(DEMO_FIELDS.heronmoor.map((f) => ({ clubId: heronmoor.id, ...f }))).onConflictDoNothing()
        .returning({ id: clubFields.id, name: clubFields.name });
      const comingField = fields.find((f) => f.name === HERONMOOR_COMING.day.fieldName);
      if (officer) {
        if (comingField) await tx.insert(clubDays).values({ clubId: heronmoor.id, fieldId: comingField.id, day: HERONMOOR_COMING.day.day, openedBy: officer.id });
        await tx.insert(contests).values({ clubId: heronmoor.id, ...HERONMOOR_COMING.contest });
      }
    }
    const [club] = await tx.insert(clubs).values(KESTREL_CLUB).returning({ id: clubs.id });
    for (const p of KESTREL_PEOPLE) {
      const [u] = await tx.insert(users).values({ email: p.email, name: p.name, passwordHash: hash, emailVerifiedAt: new Date(Date.UTC(2026, 2, 7)) }).returning({ id: users.id });
      await tx.insert(memberships).values({ clubId: club!.id, userId: u!.id, role: p.role });
    }
    await tx.insert(clubFields).values(DEMO_FIELDS.kestrel.map((f) => ({ clubId: club!.id, ...f })));
  });
}
