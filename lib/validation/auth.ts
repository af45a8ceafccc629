import { z } from "zod";

export const roleSchema = z.enum(["admin", "manager", "supervisor", "engineer", "purchaser", "operator"], {
  error: "Choose one of admin, manager, supervisor, engineer, purchaser, operator.",
});

const email = z
  .string({ error: "Enter an e-mail address." })
  .trim()
  .max(254, "An e-mail address has at most 254 characters.")
  .email("Enter a valid e-mail address.")
  .transform((s) => s.toLowerCase());

export const newPasswordSchema = z
  .string({ error: "Enter a password." })
  .min(10, "Use at least 10 characters.")
  .max(200, "Use at most 200 characters.");

export const signInSchema = z
  .object({
    email,
    password: z.string({ error: "Enter your password." }).min(1, "Enter your password.").max(200, "At most 200 characters."),
  })
  .strict();

export const inviteSchema = z
  .object({
    email,
    name: z.string({ error: "Enter a name." }).trim().min(1, "Enter a name.").max(120, "At most 120 characters."),
    role: roleSchema,
  })
  .strict();

export const userPatchSchema = z
  .object({ role: roleSchema.optional(), active: z.boolean({ error: "Must be true or false." }).optional() })
  .strict()
  .refine((v) => v.role !== undefined || v.active !== undefined, { message: "Send role or active.", path: ["role"] });

const token = z.string({ error: "The link is missing its token." }).min(20, "The link is incomplete.").max(200, "The link is not valid.");

export const acceptInviteSchema = z.object({ token, password: newPasswordSchema }).strict();
export const requestResetSchema = z.object({ email }).strict();
export const resetPasswordSchema = z.object({ token, password: newPasswordSchema }).strict();

export const unitSystemSchema = z.enum(["metric", "us"], { error: 'Choose "metric" or "us".' });
export const mePatchSchema = z.object({ unitSystem: unitSystemSchema }).strict();

export const plantSettingsSchema = z
  .object({
    plantName: z.string().trim().min(1, "Enter the plant's name.").max(120, "At most 120 characters."),
    currency: z.string().trim().regex(/^[A-Z]{3}$/, "Use a three-letter currency code such as USD or EUR."),
    shiftHours: z.number({ error: "Enter hours as a number." }).gt(0, "Must be more than 0 h.").lte(24, "At most 24 h."),
    defaultUnitSystem: unitSystemSchema,
  })
  .strict();
