import { z } from "zod";
import { passwordSchema } from "./auth";

/** The password the signed-in user types to confirm who they are (not checked for strength: it is the old one). */
const currentPassword = z.string().min(1, "Enter your current password.").max(200, "That is longer than any password here.");

export const changePasswordSchema = z
  .object({ currentPassword, newPassword: passwordSchema })
  .refine((v) => v.newPassword !== v.currentPassword, {
    path: ["newPassword"],
    message: "Choose a password different from the current one.",
  });
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;

/** Deleting an account asks for its password again. */
export const deleteAccountSchema = z.object({ password: currentPassword });
export type DeleteAccountInput = z.infer<typeof deleteAccountSchema>;

/** "Sign out everywhere" takes no input; the body is still a JSON object, like every other POST. */
export const signOutEverywhereSchema = z.object({});
