"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { FormField } from "@/components/form-field";
import { ApiError, call } from "@/lib/client/api";
import { setPasswordFormSchema } from "@/lib/domain/validation/accounts";
import { sessionApi } from "@/lib/contracts/endpoints/session";

export function SetPasswordForm({ token }: { token: string }) {
  const router = useRouter();
  const [problem, setProblem] = useState<string | null>(null);
  const form = useForm<z.input<typeof setPasswordFormSchema>>({
    resolver: zodResolver(setPasswordFormSchema),
    defaultValues: { password: "", confirm: "" },
  });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async ({ password }) => {
    setProblem(null);
    try {
      await call(sessionApi.setPassword, { body: { token, password } });
      router.replace("/sign-in?password=set");
    } catch (error) {
      setProblem(error instanceof ApiError ? error.message : "That did not work. Try again.");
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="panel flex flex-col gap-4" aria-label="Choose a password">
      <div aria-live="assertive">
        {problem ? (
          <p className="notice-error" role="alert">
            {problem}
          </p>
        ) : null}
      </div>
      <FormField id="password" label="New password" hint="At least 10 characters." error={errors.password?.message}>
        {(props) => <input {...props} {...form.register("password")} type="password" autoComplete="new-password" className="input" />}
      </FormField>
      <FormField id="confirm" label="The same password again" error={errors.confirm?.message}>
        {(props) => <input {...props} {...form.register("confirm")} type="password" autoComplete="new-password" className="input" />}
      </FormField>
      <button type="submit" className="btn btn-primary w-full" disabled={isSubmitting}>
        Set password
      </button>
    </form>
  );
}
