"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useHydrated } from "@/lib/client/use-hydrated";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { ErrorState } from "@/components/ui/states";
import { TextField } from "@/components/ui/text-field";
import { authClient } from "@/lib/client/auth-client";
import { signUpSchema, type SignUpInput } from "@/lib/validation/account";
import { minimumPasswordLength } from "@/lib/validation/password-policy";
import { authErrorToField } from "./auth-errors";

export function SignUpForm({ nextPath = "/dashboard", initialEmail = "" }: { nextPath?: string; initialEmail?: string }) {
  const router = useRouter();
  const form = useForm<SignUpInput>({ resolver: zodResolver(signUpSchema), defaultValues: { name: "", email: initialEmail, password: "" } });
  const { errors, isSubmitting } = form.formState;
  const hydrated = useHydrated();

  const onSubmit = form.handleSubmit(async (values) => {
    const { error } = await authClient.signUp.email({ name: values.name, email: values.email, password: values.password });
    if (error) {
      const { field, message } = authErrorToField(error);
      form.setError(field, { message });
      return;
    }
    router.replace(nextPath);
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5" aria-label="Create an account">
      <TextField id="name" label="Full name" autoComplete="name" error={errors.name?.message} {...form.register("name")} />
      <TextField id="email" label="Work e-mail" type="email" autoComplete="email" error={errors.email?.message} {...form.register("email")} />
      <TextField
        id="password"
        label="Password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${minimumPasswordLength} characters.`}
        error={errors.password?.message}
        {...form.register("password")}
      />
      {errors.root ? <ErrorState title="Could not create the account" message={errors.root.message ?? ""} /> : null}
      <Button type="submit" disabled={isSubmitting || !hydrated}>
        {isSubmitting ? "Creating account…" : "Create account"}
      </Button>
      <p className="text-center text-sm text-muted">
        Already have an account?{" "}
        <Link href={nextPath === "/dashboard" ? "/sign-in" : `/sign-in?next=${encodeURIComponent(nextPath)}`} className="font-medium text-tide-600 underline-offset-2 hover:underline">
          Sign in
        </Link>
      </p>
    </form>
  );
}
