"use client";

export default function ErrorPage({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <main className="mx-auto max-w-lg px-6 py-24 text-center">
      <h1 className="text-xl font-semibold">Something went wrong on our side</h1>
      <p className="mt-2 text-muted">Nothing you saved was lost. Try again; if it keeps happening, tell your administrator.</p>
      <button type="button" onClick={reset} className="mt-6 rounded-md border border-line px-3 py-1.5">
        Try again
      </button>
    </main>
  );
}
