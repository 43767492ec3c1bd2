"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { FormField } from "@/components/form-field";
import { FormResult } from "@/components/form-result";
import { ApiError } from "@/lib/client/api";
import { roleLabels, roles } from "@/lib/domain/access/permissions";
import { createAccountSchema, type CreateAccountInput } from "@/lib/domain/validation/accounts";
import { useCreateAccount } from "./use-accounts";

export function CreateAccountForm() {
  const create = useCreateAccount();
  const [result, setResult] = useState<{ ok: boolean; message: string } | null>(null);
  const form = useForm<CreateAccountInput>({
    resolver: zodResolver(createAccountSchema),
    defaultValues: { name: "", email: "", role: "student", password: "" },
  });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    setResult(null);
    try {
      const user = await create.mutateAsync(values);
      setResult({
        ok: true,
        message:
          user.status === "invited" ? `Invitation sent to ${user.email}.` : `Account for ${user.email} created with the password you gave.`,
      });
      form.reset({ name: "", email: "", role: values.role, password: "" });
    } catch (error) {
      if (error instanceof ApiError) {
        for (const [field, message] of Object.entries(error.fields)) {
          if (field === "name" || field === "email" || field === "role" || field === "password") form.setError(field, { message });
        }
      }
      setResult({ ok: false, message: error instanceof ApiError ? error.message : "The account was not created." });
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="panel flex flex-col gap-4" aria-labelledby="create-account-title">
      <h2 id="create-account-title">Add a person</h2>
      <FormResult result={result} />
      <div className="grid gap-4 md:grid-cols-2">
        <FormField id="new-name" label="Name" error={errors.name?.message}>
          {(props) => <input {...props} {...form.register("name")} autoComplete="off" className="input" />}
        </FormField>
        <FormField id="new-email" label="E-mail" error={errors.email?.message}>
          {(props) => <input {...props} {...form.register("email")} type="email" autoComplete="off" className="input" />}
        </FormField>
        <FormField id="new-role" label="Role" error={errors.role?.message}>
          {(props) => (
            <select {...props} {...form.register("role")} className="input">
              {roles.map((r) => (
                <option key={r} value={r}>
                  {roleLabels[r]}
                </option>
              ))}
            </select>
          )}
        </FormField>
        <FormField
          id="new-password"
          label="First password (optional)"
          hint="Leave empty to send an invitation by e-mail; the person then chooses a password."
          error={errors.password?.message}
        >
          {(props) => <input {...props} {...form.register("password")} type="password" autoComplete="new-password" className="input" />}
        </FormField>
      </div>
      <button type="submit" className="btn btn-primary self-start" disabled={isSubmitting}>
        Add account
      </button>
    </form>
  );
}
