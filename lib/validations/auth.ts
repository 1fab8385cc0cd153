import { z } from "zod";

export const emailSchema = z
  .string({ error: "Enter your e-mail address." })
  .trim()
  .toLowerCase()
  .min(1, "Enter your e-mail address.")
  .max(254, "That e-mail address is too long.")
  .pipe(z.email({ error: "Enter an e-mail address like name@example.org." }));

export const newPasswordSchema = z
  .string({ error: "Choose a password." })
  .min(10, "Use at least 10 characters.")
  .max(200, "Use at most 200 characters.")
  .refine((value) => /[^A-Za-z]/.test(value), "Add at least one digit or symbol.");

export const nameSchema = z.string({ error: "Enter your name." }).trim().min(1, "Enter your name.").max(120, "Use at most 120 characters.");

export const signUpSchema = z.object({
  name: nameSchema,
  email: emailSchema,
  password: newPasswordSchema,
  invitation: z.string().max(100).optional(),
});

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: "Enter your password." }).min(1, "Enter your password.").max(200),
  next: z.string().max(300).optional(),
});

export const requestResetSchema = z.object({ email: emailSchema });

export const resetPasswordSchema = z
  .object({
    token: z.string().min(10, "This reset link is incomplete.").max(100),
    password: newPasswordSchema,
    confirm: z.string(),
  })
  .refine((value) => value.password === value.confirm, { path: ["confirm"], message: "The two passwords differ." });
