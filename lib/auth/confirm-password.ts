import "server-only";
import { db } from "@/db";
import { getUserById } from "@/db/queries/users";
import { AppError } from "@/lib/errors";
import { verifyPassword } from "./password";

/**
 * Checks the password the signed-in user typed to confirm an account change (changing the
 * password, deleting the account): 403 `wrong_password` when it is not theirs; nothing changes then.
 */
export async function confirmPassword(userId: string, password: string): Promise<void> {
  const user = await getUserById(db, userId);
  if (!(await verifyPassword(password, user?.passwordHash))) throw new WrongPasswordError();
}

export class WrongPasswordError extends AppError {
  constructor() {
    super("wrong_password", "That is not your current password.", 403);
  }
}
