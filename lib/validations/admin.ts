import { z } from "zod";
import { text } from "./bounds";

/** Site administration (/admin, /api/admin/**): what an admin may send, bounded before any I/O. */

export const ADMIN_SEARCH_MAX = 200;
export const ADMIN_PAGE_MAX = 500;

/** The user search box: part of an e-mail address or a name (empty = everyone). */
export const userSearchFormSchema = z.object({
  q: text(ADMIN_SEARCH_MAX).trim(),
});
export type UserSearchForm = z.input<typeof userSearchFormSchema>;

// GET /api/admin/users — query (and /admin's own search parameters)
export const userSearchSchema = z.object({
  q: text(ADMIN_SEARCH_MAX).trim().default(""),
  page: z.coerce.number().int().min(1).max(ADMIN_PAGE_MAX).default(1),
});
export type UserSearch = z.infer<typeof userSearchSchema>;

/** /admin's audit, mail and rejections lists: each list's page in the URL (from 1). */
export const adminListPageSchema = z.coerce.number().int().min(1).max(ADMIN_PAGE_MAX);

// PATCH /api/admin/users/[userId] — path
export const adminUserParamsSchema = z.object({ userId: z.uuid() });

// PATCH /api/admin/users/[userId] — body: one change per request, each effective at the account's next request
export const adminUserActionSchema = z.discriminatedUnion("action", [
  z.object({ action: z.literal("disable") }),
  z.object({ action: z.literal("enable") }),
  z.object({ action: z.literal("set-role"), role: z.enum(["member", "admin"]) }),
]);
export type AdminUserAction = z.infer<typeof adminUserActionSchema>;

// POST /api/admin/mail/[mailId]/retry — path (the body is an empty JSON object)
export const adminMailParamsSchema = z.object({ mailId: z.uuid() });
export const adminMailRetrySchema = z.object({});
