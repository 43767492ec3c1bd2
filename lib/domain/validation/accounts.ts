// Schemas shared by the forms (react-hook-form) and the route handlers, so both say the same thing.
import { z } from "zod";
import { roles } from "@/lib/domain/access/permissions";

/** Password rules shared by every form and handler that sets one. */
export const newPasswordSchema = z.string().min(10, "Use at least 10 characters.").max(200, "Use at most 200 characters.");

export const emailSchema = z
  .string({ error: "Enter an e-mail address." })
  .trim()
  .toLowerCase()
  .max(254, "That e-mail address is too long.")
  .pipe(z.email("Enter a valid e-mail address."));

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: "Enter your password." }).min(1, "Enter your password.").max(200),
});
export type SignInInput = z.input<typeof signInSchema>;

const nameSchema = z.string({ error: "Enter a name." }).trim().min(1, "Enter a name.").max(120, "Use at most 120 characters.");

export const roleSchema = z.enum(roles, { error: "Choose a role: student, instructor, librarian or admin." });

export const createAccountSchema = z.object({
  name: nameSchema,
  email: emailSchema,
  role: roleSchema,
  // Empty means: send an invitation and let the person choose a password.
  password: z.union([z.literal(""), newPasswordSchema]).optional(),
});
export type CreateAccountInput = z.input<typeof createAccountSchema>;

export const updateAccountSchema = z
  .object({
    name: nameSchema.optional(),
    role: roleSchema.optional(),
    status: z.enum(["active", "deactivated"], { error: "Status is active or deactivated." }).optional(),
  })
  .refine((v) => v.name !== undefined || v.role !== undefined || v.status !== undefined, {
    message: "Nothing to change: give a name, role or status.",
  });

export const passwordResetRequestSchema = z.object({ email: emailSchema });

export const setPasswordSchema = z.object({
  token: z.string().min(20, "This link is not complete.").max(200),
  password: newPasswordSchema,
});

/** The form adds a second entry of the password; the API takes one. */
export const setPasswordFormSchema = z
  .object({ password: newPasswordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { message: "The two passwords differ.", path: ["confirm"] });
