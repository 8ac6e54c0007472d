// GET /api/account/export — download everything Windowcall holds about the signed-in account, as JSON
import { db } from "@/db";
import { exportAccount } from "@/db/queries/account-export";
import { route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { UnauthorizedError } from "@/lib/errors";

export const dynamic = "force-dynamic";

/** No input. A download (Content-Disposition: attachment) named after the day; never cached. */
export const GET = route(async () => {
  const user = await requireUser();
  const data = await exportAccount(db, user.id);
  if (!data) throw new UnauthorizedError();
  const day = data.exportedAt.slice(0, 10);
  return new Response(JSON.stringify(data, null, 2), {
    headers: {
      "content-type": "application/json; charset=utf-8",
      "content-disposition": `attachment; filename="windowcall-export-${day}.json"`,
      "cache-control": "no-store",
    },
  });
});
