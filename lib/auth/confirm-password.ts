import "server-only";
import { db } from "@/db";
import { getUserById } from "@/db/queries/users";
import { AppError } from "@/lib/errors";
import { verifyPassword } from "./password";

/** 403 `wrong_password` when the signed-in user's password does not match (changing it, deleting the account). */
export async function confirmPassword(userId: string, password: string, field: string): Promise<void> {
  const user = await getUserById(db, userId);
  if (!(await verifyPassword(password, user?.passwordHash))) {
    throw new WrongPasswordError(field);
  }
}

/** The password typed to confirm an account change is not the account's; `field` names the form field. */
export class WrongPasswordError extends AppError {
  constructor(readonly field: string) {
    super("wrong_password", "That is not your current password.", 403);
  }
}
