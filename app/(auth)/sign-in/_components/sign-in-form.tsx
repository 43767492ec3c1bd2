"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { FormField } from "@/components/form-field";
import { ApiError, call } from "@/lib/client/api";
import { signInSchema, type SignInInput } from "@/lib/domain/validation/accounts";
import { clearSignOutPending } from "@/lib/client/cart/store";
import { sessionApi } from "@/lib/contracts/endpoints/session";

export function SignInForm({ next }: { next: string }) {
  const router = useRouter();
  const [problem, setProblem] = useState<string | null>(null);
  const form = useForm<SignInInput>({ resolver: zodResolver(signInSchema), defaultValues: { email: "", password: "" } });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    setProblem(null);
    try {
      await call(sessionApi.signIn, { body: values });
      // A new session replaces the one an offline sign-out could not end.
      await clearSignOutPending().catch(() => undefined);
      router.replace(next);
      router.refresh();
    } catch (error) {
      setProblem(error instanceof ApiError ? error.message : "Signing in failed. Try again.");
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="panel flex flex-col gap-4" aria-label="Sign in">
      <div aria-live="assertive">
        {problem ? (
          <p className="notice-error" role="alert">
            {problem}
          </p>
        ) : null}
      </div>
      <FormField id="email" label="E-mail" error={errors.email?.message}>
        {(props) => <input {...props} {...form.register("email")} type="email" autoComplete="username" className="input" />}
      </FormField>
      <FormField id="password" label="Password" error={errors.password?.message}>
        {(props) => <input {...props} {...form.register("password")} type="password" autoComplete="current-password" className="input" />}
      </FormField>
      <button type="submit" className="btn btn-primary w-full" disabled={isSubmitting}>
        {isSubmitting ? "Signing in…" : "Sign in"}
      </button>
      <Link href="/forgot-password" className="self-start py-2">
        Forgot your password?
      </Link>
    </form>
  );
}
