import "server-only";
import { db } from "@/db";
import { getUserById } from "@/db/queries/users";
import { AppError, RateLimitError } from "@/lib/errors";
import { AttemptThrottledError, beginSignInAttempt } from "./attempts";
import { clientAddress } from "./client-address";
import { knownDeviceId } from "./known-device";
import { verifyPassword } from "./password";

/**
 * Checks the password the signed-in user typed to confirm an account change (changing the
 * password, deleting the account): 403 `wrong_password` when it is not theirs; nothing changes then.
 * It is a password guess like any sign-in, so it is counted first by the same limits (attempts.ts):
 * a stolen session cannot be used to try passwords at leisure. Past the limit, 429.
 */
export async function confirmPassword(userId: string, password: string, request: Request): Promise<void> {
  const user = await getUserById(db, userId);
  const account = user?.email ?? userId;
  const headers = Object.fromEntries(request.headers);
  const attempt = await beginSignInAttempt(account, clientAddress(headers), knownDeviceId(account, headers)).catch((error: unknown) => {
    if (error instanceof AttemptThrottledError) {
      throw new RateLimitError(`Too many wrong passwords. Try again in ${Math.max(1, Math.ceil(error.retryAfterMs / 60_000))} minutes.`);
    }
    throw error;
  });
  if (!(await verifyPassword(password, user?.passwordHash))) throw new WrongPasswordError();
  await attempt.succeeded();
}

export class WrongPasswordError extends AppError {
  constructor() {
    super("wrong_password", "That is not your current password.", 403);
  }
}
