"use client";

/** Shown when a page fails; never shows the error's details (they are in the server log). */
export default function ErrorPage({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <main className="mx-auto flex min-h-[60vh] max-w-lg flex-col items-center justify-center gap-4 px-6 text-center">
      <p className="font-mono text-sm text-chart-muted">500 · lost bearing</p>
      <h1 className="text-3xl font-semibold">Something went wrong on our side</h1>
      <p className="text-chart-muted">The problem was logged. Try again; if it keeps happening, tell your workspace owner.</p>
      <button type="button" className="btn-primary" onClick={() => reset()}>
        Try again
      </button>
    </main>
  );
}
