import { z } from "zod";
import { emailSchema } from "./auth";
import { text } from "./bounds";

/** Roles inside a club, weakest first. */
export const CLUB_ROLES = ["member", "coach", "officer"] as const;
export const clubRoleSchema = z.enum(CLUB_ROLES, { message: "Choose member, coach or officer." });

/** A club's address name: lower-case letters, digits and single hyphens (what /clubs/[slug] accepts). */
export const clubSlugSchema = z.string().regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, "Not a club address.").max(60, "Not a club address.");

export const createClubSchema = z.object({
  name: text(80).trim().min(2, "Give the club a name of at least 2 characters.").max(80, "Use at most 80 characters."),
});
export type CreateClubInput = z.infer<typeof createClubSchema>;

export const inviteSchema = z.object({ email: emailSchema, role: clubRoleSchema });
export type InviteInput = z.infer<typeof inviteSchema>;

export const changeRoleSchema = z.object({ role: clubRoleSchema });

/** A note of a field, or empty (stored as null). */
const note = (label: string) =>
  text(600)
    .trim()
    .max(600, `${label}: use at most 600 characters.`)
    .nullable()
    .optional()
    .transform((s) => (s ? s : null));

/** A number typed in a form, or empty. */
const coordinate = (label: string, limit: number) =>
  z
    .union([z.number(), z.string().trim()])
    .transform((v, ctx) => {
      if (v === "") return null;
      const n = typeof v === "number" ? v : Number(v.replace(",", "."));
      if (!Number.isFinite(n) || Math.abs(n) > limit) {
        ctx.addIssue({ code: "custom", message: `${label} is a number from −${limit} to ${limit}.` });
        return z.NEVER;
      }
      return Math.round(n * 1e5) / 1e5;
    })
    .nullable()
    .optional()
    .transform((v) => v ?? null);

export const clubFieldSchema = z.object({
  name: text(80).trim().min(2, "Name the field (at least 2 characters).").max(80, "Use at most 80 characters."),
  latitude: coordinate("Latitude", 90),
  longitude: coordinate("Longitude", 180),
  launchDirection: note("Launch direction"),
  safetyAreas: note("Safety areas"),
  localRules: note("Local rules"),
});
export type ClubFieldInput = z.input<typeof clubFieldSchema>;
export type ClubField = z.output<typeof clubFieldSchema>;

export const routeIdSchema = z.uuid({ message: "Not found." });

/**
 * A club route's path: its address name, or null when it could not name any club (the route still
 * checks the session first, so signed out is 401, then answers 404 as for a club that does not exist).
 */
export function clubRef(params: { slug?: unknown }): { slug: string | null } {
  const slug = clubSlugSchema.safeParse(params.slug);
  return { slug: slug.success ? slug.data : null };
}

/** An id in a route's path, or null when it is not one (then nothing can match it: 404). */
export function pathId(value: unknown): string | null {
  const id = routeIdSchema.safeParse(value);
  return id.success ? id.data : null;
}
