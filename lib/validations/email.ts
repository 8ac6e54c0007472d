import { z } from "zod";
import { emailSchema, passwordSchema } from "./auth";

/** A one-time link's token as we make them (43 base64url characters); anything else is refused before any I/O. */
export const emailTokenSchema = z.string().regex(/^[A-Za-z0-9_-]{20,100}$/, "This link is not valid. Open the link from the e-mail again.");

export const tokenBodySchema = z.object({ token: emailTokenSchema });

export const forgotPasswordSchema = z.object({ email: emailSchema });

export const resetPasswordSchema = z.object({ token: emailTokenSchema, password: passwordSchema });

export const changeEmailSchema = z.object({
  newEmail: emailSchema,
  currentPassword: z.string().min(1, "Enter your current password.").max(200, "That is longer than any password here."),
});
export type ChangeEmailInput = z.infer<typeof changeEmailSchema>;

/** The reset page's form: the new password (the token comes from the link, not the form). */
export const resetPasswordFormSchema = z.object({ password: passwordSchema });
export type ResetPasswordFormInput = z.infer<typeof resetPasswordFormSchema>;
export type ForgotPasswordInput = z.infer<typeof forgotPasswordSchema>;

/** Asking for the verification e-mail again takes no input. */
export const resendVerificationSchema = z.object({});
