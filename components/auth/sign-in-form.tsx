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
import { signInSchema, type SignInInput } from "@/lib/validation/account";
import { authErrorToField } from "./auth-errors";

export function SignInForm({ nextPath }: { nextPath: string }) {
  const router = useRouter();
  const form = useForm<SignInInput>({ resolver: zodResolver(signInSchema), defaultValues: { email: "", password: "" } });
  const { errors, isSubmitting } = form.formState;
  const hydrated = useHydrated();

  const onSubmit = form.handleSubmit(async (values) => {
    const { error } = await authClient.signIn.email({ email: values.email, password: values.password });
    if (error) {
      const { field, message } = authErrorToField(error);
      form.setError(field === "name" ? "root" : field, { message });
      return;
    }
    router.replace(nextPath);
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5" aria-label="Sign in">
      <TextField id="email" label="E-mail" type="email" autoComplete="email" error={errors.email?.message} {...form.register("email")} />
      <TextField id="password" label="Password" type="password" autoComplete="current-password" error={errors.password?.message} {...form.register("password")} />
      {errors.root ? <ErrorState title="Could not sign in" message={errors.root.message ?? ""} /> : null}
      <Button type="submit" disabled={isSubmitting || !hydrated}>
        {isSubmitting ? "Signing in…" : "Sign in"}
      </Button>
      <p className="text-center text-sm text-muted">
        New to Rarefact?{" "}
        <Link href={nextPath === "/dashboard" ? "/sign-up" : `/sign-up?next=${encodeURIComponent(nextPath)}`} className="font-medium text-tide-600 underline-offset-2 hover:underline">
          Create an account
        </Link>
      </p>
    </form>
  );
}
