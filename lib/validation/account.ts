// Sign-up and sign-in fields, checked in the browser before sending and again by better-auth.
import { z } from "zod";
import { minimumPasswordLength } from "./password-policy";

const email = z.string().trim().min(1, "Enter your e-mail address.").email("Enter a valid e-mail address, like name@example.com.");

export const signInSchema = z.object({
  email,
  password: z.string().min(1, "Enter your password."),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const signUpSchema = z.object({
  name: z.string().trim().min(2, "Enter your name (at least 2 characters).").max(80, "Name can be at most 80 characters."),
  email,
  password: z
    .string()
    .min(minimumPasswordLength, `Use at least ${minimumPasswordLength} characters.`)
    .max(128, "Use at most 128 characters."),
});
export type SignUpInput = z.infer<typeof signUpSchema>;
