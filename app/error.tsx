"use client";

export default function ErrorPage({ reset }: { error: Error; reset: () => void }) {
  return (
    <main id="main" className="mx-auto flex max-w-xl flex-col gap-4 px-4 py-16">
      <h1>Something went wrong</h1>
      <p>The page could not be shown. Nothing you saved is lost. Try again; if it keeps happening, tell an admin.</p>
      <button type="button" className="btn btn-primary self-start" onClick={reset}>
        Try again
      </button>
    </main>
  );
}
