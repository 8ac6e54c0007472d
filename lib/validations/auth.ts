import { z } from "zod";
import { text } from "./bounds";

export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .pipe(z.email({ message: "Enter a valid e-mail address." }))
  .pipe(z.string().max(254, "That e-mail address is too long."));

/** Password rules: long enough to resist guessing, not absurdly long (bcrypt reads 72 bytes). */
export const passwordSchema = z
  .string()
  .min(10, "Use at least 10 characters.")
  .max(72, "Use at most 72 characters.")
  .refine((p) => new Set(p).size >= 4, "Use a less repetitive password.");

export const signUpSchema = z.object({
  name: text(80).trim().min(1, "Enter your name.").max(80, "Use at most 80 characters."),
  email: emailSchema,
  password: passwordSchema,
});
export type SignUpInput = z.infer<typeof signUpSchema>;

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, "Enter your password.").max(200),
});
export type SignInInput = z.infer<typeof signInSchema>;
