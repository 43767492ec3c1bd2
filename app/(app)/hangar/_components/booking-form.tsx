"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { FormField } from "@/components/form-field";
import { FormResult } from "@/components/form-result";
import { ApiError, call } from "@/lib/client/api";
import { fleetApi } from "@/lib/contracts/endpoints/fleet";
import { bookingPurposes, bookingPurposeWords } from "@/lib/domain/fleet/fleet";

type Option = { id: string; label: string };

// The form's own shape: a day and two clock times on this laptop's clock (the school's), made
// into the API's times when sent. The server checks everything again, overlaps included.
const formSchema = z
  .object({
    assetId: z.uuid("Choose the asset."),
    placeId: z.uuid("Choose the place."),
    classId: z.string(),
    purpose: z.enum(bookingPurposes),
    day: z.iso.date("Choose the day."),
    from: z.string().regex(/^\d{2}:\d{2}$/, "Give the start, such as 08:00."),
    to: z.string().regex(/^\d{2}:\d{2}$/, "Give the end, such as 12:00."),
    note: z.string().trim().max(300, "Use at most 300 characters."),
  })
  .refine((v) => v.to > v.from, { message: "The end comes after the start.", path: ["to"] });
type Values = z.infer<typeof formSchema>;

/** Booking an asset at a place; a conflict is shown as the server words it, naming who holds it. */
export function BookingForm({
  assets,
  places,
  classes,
  defaultDay,
}: {
  assets: Option[];
  places: Option[];
  classes: Option[];
  defaultDay: string;
}) {
  const router = useRouter();
  const [result, setResult] = useState<{ ok: boolean; message: string } | null>(null);
  const form = useForm<Values>({
    resolver: zodResolver(formSchema),
    defaultValues: {
      assetId: "",
      placeId: "",
      classId: classes[0]?.id ?? "",
      purpose: "session",
      day: defaultDay,
      from: "08:00",
      to: "12:00",
      note: "",
    },
  });
  const { errors, isSubmitting } = form.formState;
  return (
    <form
      noValidate
      className="panel flex flex-col gap-4"
      aria-labelledby="book-title"
      onSubmit={form.handleSubmit(async (v) => {
        setResult(null);
        try {
          const { booking } = await call(fleetApi.createBooking, {
            body: {
              assetId: v.assetId,
              placeId: v.placeId,
              classId: v.classId || null,
              purpose: v.purpose,
              note: v.note,
              startsAt: new Date(`${v.day}T${v.from}`).toISOString(),
              endsAt: new Date(`${v.day}T${v.to}`).toISOString(),
            },
          });
          setResult({ ok: true, message: `Booked: ${booking.assetIdentifier} in ${booking.placeName}.` });
          router.refresh();
        } catch (error) {
          setResult({ ok: false, message: error instanceof ApiError ? error.message : "The booking was not made." });
        }
      })}
    >
      <h2 id="book-title">Book an asset</h2>
      <FormResult result={result} />
      <div className="grid gap-4 md:grid-cols-3">
        <FormField id="book-asset" label="Asset" error={errors.assetId?.message}>
          {(props) => (
            <select {...props} {...form.register("assetId")} className="input">
              <option value="">Choose…</option>
              {assets.map((a) => (
                <option key={a.id} value={a.id}>
                  {a.label}
                </option>
              ))}
            </select>
          )}
        </FormField>
        <FormField id="book-place" label="Place" error={errors.placeId?.message}>
          {(props) => (
            <select {...props} {...form.register("placeId")} className="input">
              <option value="">Choose…</option>
              {places.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.label}
                </option>
              ))}
            </select>
          )}
        </FormField>
        <FormField id="book-class" label="For the class" error={errors.classId?.message}>
          {(props) => (
            <select {...props} {...form.register("classId")} className="input">
              <option value="">No class</option>
              {classes.map((c) => (
                <option key={c.id} value={c.id}>
                  {c.label}
                </option>
              ))}
            </select>
          )}
        </FormField>
        <FormField id="book-purpose" label="What for" error={errors.purpose?.message}>
          {(props) => (
            <select {...props} {...form.register("purpose")} className="input">
              {bookingPurposes.map((p) => (
                <option key={p} value={p}>
                  {bookingPurposeWords[p]}
                </option>
              ))}
            </select>
          )}
        </FormField>
        <FormField id="book-day" label="Day" error={errors.day?.message}>
          {(props) => <input {...props} {...form.register("day")} type="date" className="input" />}
        </FormField>
        <div className="grid grid-cols-2 gap-3">
          <FormField id="book-from" label="From" error={errors.from?.message}>
            {(props) => <input {...props} {...form.register("from")} type="time" className="input" />}
          </FormField>
          <FormField id="book-to" label="To" error={errors.to?.message}>
            {(props) => <input {...props} {...form.register("to")} type="time" className="input" />}
          </FormField>
        </div>
        <FormField id="book-note" label="Note" hint="What the session covers, where from" error={errors.note?.message}>
          {(props) => <input {...props} {...form.register("note")} className="input md:col-span-2" />}
        </FormField>
      </div>
      <button type="submit" className="btn btn-primary self-start" disabled={isSubmitting}>
        Book it
      </button>
    </form>
  );
}
