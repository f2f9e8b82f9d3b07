import { z } from "zod";
import { plainText } from "./text";

export const PASSWORD_MIN = 10;

const email = z.string().trim().toLowerCase().email("enter an e-mail address such as name@shop.example");
const password = z.string().min(PASSWORD_MIN, `use at least ${PASSWORD_MIN} characters`).max(128, "at most 128 characters");

/** Shared by the sign-up form and the server. */
export const signUpInput = z.object({ name: plainText("name", 80).min(1, "enter your name"), email, password });
export const signInInput = z.object({ email, password: z.string().min(1, "enter your password") });
export const forgotPasswordInput = z.object({ email });
export const resetPasswordInput = z
  .object({ password, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "the two passwords differ" });

export type SignUpInput = z.infer<typeof signUpInput>;
export type SignInInput = z.infer<typeof signInInput>;
export const changePasswordInput = z
  .object({ currentPassword: z.string().min(1, "enter your current password"), password, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "the two passwords differ" });
export const deleteAccountInput = z.object({
  password: z.string().min(1, "enter your password"),
  confirm: z.literal(true, { error: "tick the box to confirm" }),
});
