"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, useWatch, type FieldValues, type Path, type UseFormReturn } from "react-hook-form";
import type { z } from "zod";
import { FormField } from "@/components/form-field";
import { FormResult } from "@/components/form-result";
import { ApiError, call } from "@/lib/client/api";
import { toolsApi } from "@/lib/contracts/endpoints/tools";
import { calibrationSchema, createKitSchema, createToolSchema } from "@/lib/domain/validation/tools";

type Result = { ok: boolean; message: string } | null;

/** The server's field messages beside their fields; the summary at the top. */
function showError<T extends FieldValues>(
  form: UseFormReturn<T, unknown, unknown>,
  error: unknown,
  fallback: string,
  setResult: (r: Result) => void,
) {
  if (error instanceof ApiError) for (const [field, message] of Object.entries(error.fields)) form.setError(field as Path<T>, { message });
  setResult({ ok: false, message: error instanceof ApiError ? error.message : fallback });
}

const numberOrNull = (v: unknown) => (v === "" || v === null || v === undefined ? null : Number(v));

export function AddToolForm({ kits }: { kits: { id: string; number: string; name: string }[] }) {
  const router = useRouter();
  const [result, setResult] = useState<Result>(null);
  const form = useForm<z.input<typeof createToolSchema>, unknown, z.output<typeof createToolSchema>>({
    resolver: zodResolver(createToolSchema),
    defaultValues: { number: "", description: "", kitId: null, calibrated: false, calibrationIntervalDays: null, calibrationDueOn: null },
  });
  const { errors, isSubmitting } = form.formState;
  const calibrated = useWatch({ control: form.control, name: "calibrated" });
  return (
    <form
      noValidate
      className="panel flex flex-col gap-4"
      aria-labelledby="add-tool-title"
      onSubmit={form.handleSubmit(async (values) => {
        setResult(null);
        try {
          await call(toolsApi.createTool, { body: values });
          setResult({ ok: true, message: `${values.number} added. Print its label from the label sheet.` });
          form.reset();
          router.refresh();
        } catch (error) {
          showError(form, error, "The tool was not added.", setResult);
        }
      })}
    >
      <h2 id="add-tool-title">Add a tool</h2>
      <FormResult result={result} />
      <div className="grid gap-4 md:grid-cols-2">
        <FormField id="tool-number" label="Number" hint="Letters, a dash and digits, such as T-104" error={errors.number?.message}>
          {(props) => <input {...props} {...form.register("number")} className="input font-mono uppercase" autoComplete="off" />}
        </FormField>
        <FormField id="tool-description" label="What it is" error={errors.description?.message}>
          {(props) => <input {...props} {...form.register("description")} className="input" />}
        </FormField>
        <FormField id="tool-kit" label="Kept in kit" error={errors.kitId?.message}>
          {(props) => (
            <select {...props} {...form.register("kitId", { setValueAs: (v) => v || null })} className="input">
              <option value="">No kit: lent on its own</option>
              {kits.map((k) => (
                <option key={k.id} value={k.id}>
                  {k.number} {k.name}
                </option>
              ))}
            </select>
          )}
        </FormField>
        <label className="flex min-h-11 items-center gap-3 self-end font-semibold">
          <input type="checkbox" className="h-6 w-6" {...form.register("calibrated")} />
          Calibrated tool (torque wrench, tensiometer, micrometer…)
        </label>
        {calibrated ? (
          <>
            <FormField id="tool-interval" label="Calibration interval (days)" error={errors.calibrationIntervalDays?.message}>
              {(props) => (
                <input
                  {...props}
                  {...form.register("calibrationIntervalDays", { setValueAs: numberOrNull })}
                  inputMode="numeric"
                  className="input"
                />
              )}
            </FormField>
            <FormField id="tool-due" label="Calibration due on" hint="From its certificate" error={errors.calibrationDueOn?.message}>
              {(props) => (
                <input {...props} {...form.register("calibrationDueOn", { setValueAs: (v) => v || null })} type="date" className="input" />
              )}
            </FormField>
          </>
        ) : null}
      </div>
      {errors.calibrated?.message ? <p className="field-error">{errors.calibrated.message}</p> : null}
      <button type="submit" className="btn btn-primary self-start" disabled={isSubmitting}>
        Add tool
      </button>
    </form>
  );
}

export function AddKitForm() {
  const router = useRouter();
  const [result, setResult] = useState<Result>(null);
  const form = useForm<z.input<typeof createKitSchema>, unknown, z.output<typeof createKitSchema>>({
    resolver: zodResolver(createKitSchema),
    defaultValues: { number: "", name: "", location: "" },
  });
  const { errors, isSubmitting } = form.formState;
  return (
    <form
      noValidate
      className="panel flex flex-col gap-4"
      aria-labelledby="add-kit-title"
      onSubmit={form.handleSubmit(async (values) => {
        setResult(null);
        try {
          await call(toolsApi.createKit, { body: values });
          setResult({ ok: true, message: `Kit ${values.number} added. Add its tools with "Kept in kit".` });
          form.reset();
          router.refresh();
        } catch (error) {
          showError(form, error, "The kit was not added.", setResult);
        }
      })}
    >
      <h2 id="add-kit-title">Add a kit</h2>
      <FormResult result={result} />
      <div className="grid gap-4 md:grid-cols-3">
        <FormField id="kit-number" label="Number" hint="Such as K-04" error={errors.number?.message}>
          {(props) => <input {...props} {...form.register("number")} className="input font-mono uppercase" autoComplete="off" />}
        </FormField>
        <FormField id="kit-name" label="Name" error={errors.name?.message}>
          {(props) => <input {...props} {...form.register("name")} className="input" />}
        </FormField>
        <FormField id="kit-location" label="Kept at (optional)" error={errors.location?.message}>
          {(props) => <input {...props} {...form.register("location")} className="input" />}
        </FormField>
      </div>
      <button type="submit" className="btn btn-primary self-start" disabled={isSubmitting}>
        Add kit
      </button>
    </form>
  );
}

export function CalibrationForm({ toolId, number, intervalDays }: { toolId: string; number: string; intervalDays: number | null }) {
  const router = useRouter();
  const [result, setResult] = useState<Result>(null);
  const form = useForm<z.input<typeof calibrationSchema>, unknown, z.output<typeof calibrationSchema>>({
    resolver: zodResolver(calibrationSchema),
    defaultValues: { calibratedOn: "", calibratedBy: "", certificate: "", nextDueOn: undefined },
  });
  const { errors, isSubmitting } = form.formState;
  return (
    <form
      noValidate
      className="panel flex flex-col gap-4"
      aria-labelledby={`calibrate-${toolId}`}
      onSubmit={form.handleSubmit(async (values) => {
        setResult(null);
        try {
          const { calibration } = await call(toolsApi.recordCalibration, { params: { id: toolId }, body: values });
          setResult({ ok: true, message: `Calibration of ${number} recorded: next due ${calibration.nextDueOn}.` });
          form.reset();
          router.refresh();
        } catch (error) {
          showError(form, error, "The calibration was not recorded.", setResult);
        }
      })}
    >
      <h2 id={`calibrate-${toolId}`}>Record a calibration of {number}</h2>
      <FormResult result={result} />
      <div className="grid gap-4 md:grid-cols-2">
        <FormField id={`cal-on-${toolId}`} label="Calibrated on" error={errors.calibratedOn?.message}>
          {(props) => <input {...props} {...form.register("calibratedOn")} type="date" className="input" />}
        </FormField>
        <FormField id={`cal-by-${toolId}`} label="Calibrated by" error={errors.calibratedBy?.message}>
          {(props) => <input {...props} {...form.register("calibratedBy")} className="input" />}
        </FormField>
        <FormField id={`cal-cert-${toolId}`} label="Certificate number" error={errors.certificate?.message}>
          {(props) => <input {...props} {...form.register("certificate")} className="input" />}
        </FormField>
        <FormField
          id={`cal-next-${toolId}`}
          label="Next due"
          hint={intervalDays ? `Left empty: ${intervalDays} days after the calibration` : "From the certificate"}
          error={errors.nextDueOn?.message}
        >
          {(props) => (
            <input {...props} {...form.register("nextDueOn", { setValueAs: (v) => v || undefined })} type="date" className="input" />
          )}
        </FormField>
      </div>
      <button type="submit" className="btn btn-primary self-start" disabled={isSubmitting}>
        Record calibration
      </button>
    </form>
  );
}
