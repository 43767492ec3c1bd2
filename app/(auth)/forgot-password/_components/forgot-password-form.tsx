"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { FormField } from "@/components/form-field";
import { FormResult } from "@/components/form-result";
import { ApiError, call } from "@/lib/client/api";
import { passwordResetRequestSchema } from "@/lib/domain/validation/accounts";
import { sessionApi } from "@/lib/contracts/endpoints/session";

export function ForgotPasswordForm() {
  const [result, setResult] = useState<{ ok: boolean; message: string } | null>(null);
  const form = useForm<z.input<typeof passwordResetRequestSchema>>({
    resolver: zodResolver(passwordResetRequestSchema),
    defaultValues: { email: "" },
  });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      const { message } = await call(sessionApi.requestReset, { body: values });
      setResult({ ok: true, message });
    } catch (error) {
      setResult({ ok: false, message: error instanceof ApiError ? error.message : "That did not work. Try again." });
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="panel flex flex-col gap-4" aria-label="Ask for a password link">
      <FormResult result={result} />
      <FormField id="email" label="E-mail" error={errors.email?.message}>
        {(props) => <input {...props} {...form.register("email")} type="email" autoComplete="email" className="input" />}
      </FormField>
      <button type="submit" className="btn btn-primary w-full" disabled={isSubmitting}>
        Send the link
      </button>
    </form>
  );
}
