"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { FormField } from "@/components/form-field";
import { FormResult } from "@/components/form-result";
import { ApiError, call } from "@/lib/client/api";
import { fleetApi } from "@/lib/contracts/endpoints/fleet";
import {
  assetKinds,
  assetKindWords,
  assetStatuses,
  assetStatusWords,
  findingDecisions,
  findingDecisionWords,
} from "@/lib/domain/fleet/fleet";
import { createAssetSchema, decideFindingSchema, findingSchema } from "@/lib/domain/validation/fleet";

type Result = { ok: boolean; message: string } | null;

export function AddAssetForm() {
  const router = useRouter();
  const [result, setResult] = useState<Result>(null);
  const form = useForm<z.input<typeof createAssetSchema>, unknown, z.output<typeof createAssetSchema>>({
    resolver: zodResolver(createAssetSchema),
    defaultValues: {
      identifier: "",
      kind: "aircraft",
      model: "",
      serial: "",
      status: "instructional",
      statusReason: "",
      location: "",
      spanMetres: null,
    },
  });
  const { errors, isSubmitting } = form.formState;
  return (
    <form
      noValidate
      className="panel flex flex-col gap-4"
      aria-labelledby="add-asset-title"
      onSubmit={form.handleSubmit(async (values) => {
        setResult(null);
        try {
          await call(fleetApi.createAsset, { body: values });
          setResult({ ok: true, message: `${values.identifier} added to the fleet.` });
          form.reset();
          router.refresh();
        } catch (error) {
          if (error instanceof ApiError)
            for (const [f, m] of Object.entries(error.fields)) form.setError(f as "identifier", { message: m });
          setResult({ ok: false, message: error instanceof ApiError ? error.message : "The asset was not added." });
        }
      })}
    >
      <h2 id="add-asset-title">Add an asset</h2>
      <FormResult result={result} />
      <div className="grid gap-4 md:grid-cols-3">
        <FormField id="asset-identifier" label="Registration or school number" error={errors.identifier?.message}>
          {(props) => <input {...props} {...form.register("identifier")} className="input font-mono uppercase" autoComplete="off" />}
        </FormField>
        <FormField id="asset-kind" label="Kind" error={errors.kind?.message}>
          {(props) => (
            <select {...props} {...form.register("kind")} className="input">
              {assetKinds.map((k) => (
                <option key={k} value={k}>
                  {assetKindWords[k]}
                </option>
              ))}
            </select>
          )}
        </FormField>
        <FormField id="asset-model" label="Model" hint="As the manuals' applicability writes it" error={errors.model?.message}>
          {(props) => <input {...props} {...form.register("model")} className="input" />}
        </FormField>
        <FormField id="asset-serial" label="Serial number" error={errors.serial?.message}>
          {(props) => <input {...props} {...form.register("serial")} className="input font-mono" />}
        </FormField>
        <FormField id="asset-status" label="Status" error={errors.status?.message}>
          {(props) => (
            <select {...props} {...form.register("status")} className="input">
              {assetStatuses.map((s) => (
                <option key={s} value={s}>
                  {assetStatusWords[s]}
                </option>
              ))}
            </select>
          )}
        </FormField>
        <FormField id="asset-span" label="Span (m)" hint="Aircraft: checked against the bays" error={errors.spanMetres?.message}>
          {(props) => (
            <input
              {...props}
              {...form.register("spanMetres", { setValueAs: (v) => (v === "" || v === null ? null : Number(v)) })}
              className="input"
              inputMode="decimal"
            />
          )}
        </FormField>
      </div>
      <button type="submit" className="btn btn-primary self-start" disabled={isSubmitting}>
        Add the asset
      </button>
    </form>
  );
}

/** Writing up what was found on the asset, from its page (at the cart the run's screen does it, offline too). */
export function FileFindingForm({ assetId, identifier }: { assetId: string; identifier: string }) {
  const router = useRouter();
  const [result, setResult] = useState<Result>(null);
  const form = useForm<z.input<typeof findingSchema>, unknown, z.output<typeof findingSchema>>({
    resolver: zodResolver(findingSchema),
    defaultValues: { assetId, text: "" },
  });
  const { errors, isSubmitting } = form.formState;
  return (
    <form
      noValidate
      className="flex flex-col gap-3"
      onSubmit={form.handleSubmit(async (values) => {
        setResult(null);
        try {
          await call(fleetApi.fileFinding, { body: { ...values, id: crypto.randomUUID() } });
          setResult({ ok: true, message: `Written up on ${identifier}. Your instructor decides what happens.` });
          form.reset({ assetId, text: "" });
          router.refresh();
        } catch (error) {
          setResult({ ok: false, message: error instanceof ApiError ? error.message : "The finding was not filed." });
        }
      })}
    >
      <FormField
        id="finding-text"
        label={`What did you find on ${identifier}?`}
        hint="Where, what it looks like, how big"
        error={errors.text?.message}
      >
        {(props) => <textarea {...props} {...form.register("text")} className="input min-h-28" />}
      </FormField>
      <button type="submit" className="btn btn-primary self-start" disabled={isSubmitting}>
        File the finding
      </button>
      <FormResult result={result} />
    </form>
  );
}

/** The instructor's decision on a finding, which closes it. */
export function DecideFindingForm({ findingId, onDone }: { findingId: string; onDone?: (message: string) => void }) {
  const router = useRouter();
  const [result, setResult] = useState<Result>(null);
  const form = useForm<z.input<typeof decideFindingSchema>, unknown, z.output<typeof decideFindingSchema>>({
    resolver: zodResolver(decideFindingSchema),
    defaultValues: { decision: "fixed_in_run", note: "" },
  });
  const { errors, isSubmitting } = form.formState;
  return (
    <form
      noValidate
      className="flex flex-col gap-3"
      aria-label="Decide and close"
      onSubmit={form.handleSubmit(async (values) => {
        setResult(null);
        try {
          const { finding } = await call(fleetApi.decideFinding, { params: { id: findingId }, body: values });
          const message = `Closed: ${findingDecisionWords[finding.decision!].toLowerCase()}.`;
          setResult({ ok: true, message });
          onDone?.(message);
          router.refresh();
        } catch (error) {
          if (error instanceof ApiError && error.fields.note) form.setError("note", { message: error.fields.note });
          setResult({ ok: false, message: error instanceof ApiError ? error.message : "The finding was not closed." });
        }
      })}
    >
      <fieldset className="flex flex-wrap gap-2">
        <legend className="label">What happens</legend>
        {findingDecisions.map((d) => (
          <label key={d} className="flex min-h-11 items-center gap-2 rounded border border-line px-3">
            <input type="radio" value={d} {...form.register("decision")} className="h-5 w-5" />
            {findingDecisionWords[d]}
          </label>
        ))}
      </fieldset>
      <FormField id={`decide-note-${findingId}`} label="Note" hint="Needed when deferred or out of service" error={errors.note?.message}>
        {(props) => <input {...props} {...form.register("note")} className="input" />}
      </FormField>
      <button type="submit" className="btn btn-primary self-start" disabled={isSubmitting}>
        Close the finding
      </button>
      <FormResult result={result} />
    </form>
  );
}
