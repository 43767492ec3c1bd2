/** The outcome of a form, read out when it appears: green for done, red for refused. */
export function FormResult({ result }: { result: { ok: boolean; message: string } | null }) {
  return (
    <div aria-live="polite">
      {result ? (
        <p className={result.ok ? "notice-ok" : "notice-error"} role="status">
          {result.message}
        </p>
      ) : null}
    </div>
  );
}
