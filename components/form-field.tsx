import type { ReactNode } from "react";

/**
 * A labelled field with its hint and error tied to the input by id, so a screen reader reads them
 * with the input. The input itself is the child, given `id`, `aria-describedby` and `aria-invalid`.
 */
export function FormField({
  id,
  label,
  hint,
  error,
  children,
}: {
  id: string;
  label: string;
  hint?: string;
  error?: string;
  children: (props: { id: string; "aria-describedby"?: string; "aria-invalid": boolean }) => ReactNode;
}) {
  const describedBy = [hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter(Boolean).join(" ") || undefined;
  return (
    <div className="field">
      <label htmlFor={id} className="label">
        {label}
      </label>
      {hint ? (
        <span id={`${id}-hint`} className="hint">
          {hint}
        </span>
      ) : null}
      {children({ id, "aria-describedby": describedBy, "aria-invalid": !!error })}
      <span id={`${id}-error`} className="field-error" aria-live="polite">
        {error ?? ""}
      </span>
    </div>
  );
}
