"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { FormField } from "@/components/form-field";
import { FormResult } from "@/components/form-result";
import { ApiError, call } from "@/lib/client/api";
import { createClassSchema, type CreateClassInput } from "@/lib/domain/validation/classes";
import { classesApi } from "@/lib/contracts/endpoints/classes";

export function CreateClassForm() {
  const router = useRouter();
  const [result, setResult] = useState<{ ok: boolean; message: string } | null>(null);
  const form = useForm<CreateClassInput, unknown, z.output<typeof createClassSchema>>({
    resolver: zodResolver(createClassSchema),
    defaultValues: { name: "", description: "", startsOn: "", endsOn: "" },
  });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    setResult(null);
    try {
      await call(classesApi.create, { body: values });
      setResult({ ok: true, message: `Class "${values.name}" added.` });
      form.reset();
      router.refresh();
    } catch (error) {
      if (error instanceof ApiError && error.fields.name) form.setError("name", { message: error.fields.name });
      setResult({ ok: false, message: error instanceof ApiError ? error.message : "The class was not added." });
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="panel flex flex-col gap-4" aria-labelledby="create-class-title">
      <h2 id="create-class-title">Add a class</h2>
      <FormResult result={result} />
      <div className="grid gap-4 md:grid-cols-2">
        <FormField id="class-name" label="Name" error={errors.name?.message}>
          {(props) => <input {...props} {...form.register("name")} className="input" />}
        </FormField>
        <FormField id="class-description" label="Description (optional)" error={errors.description?.message}>
          {(props) => <input {...props} {...form.register("description")} className="input" />}
        </FormField>
        <FormField id="class-starts" label="Starts on (optional)" error={errors.startsOn?.message}>
          {(props) => <input {...props} {...form.register("startsOn")} type="date" className="input" />}
        </FormField>
        <FormField id="class-ends" label="Ends on (optional)" error={errors.endsOn?.message}>
          {(props) => <input {...props} {...form.register("endsOn")} type="date" className="input" />}
        </FormField>
      </div>
      <button type="submit" className="btn btn-primary self-start" disabled={isSubmitting}>
        Add class
      </button>
    </form>
  );
}
