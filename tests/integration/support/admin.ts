import { eq } from "drizzle-orm";
import { PATCH as changeUserRoute } from "@/app/api/admin/users/[userId]/route";
import { adminActions } from "@/db/schema";
import { db } from "./db";

/** PATCH /api/admin/users/[userId] called in-process as whoever actAs() chose. */
export function patchUser(userId: string, body: unknown): Promise<Response> {
  const request = new Request(`http://test/api/admin/users/${userId}`, {
    method: "PATCH", body: JSON.stringify(body), headers: { "content-type": "application/json" },
  });
  return changeUserRoute(request, { params: Promise.resolve({ userId }) });
}

/** The audit entries about one account, oldest first. */
export async function auditOf(userId: string) {
  return db.select().from(adminActions).where(eq(adminActions.targetUserId, userId)).orderBy(adminActions.createdAt);
}
