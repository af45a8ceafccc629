"use client";

export default function ErrorPage({ reset }: { error: Error; reset: () => void }) {
  return (
    <main className="mx-auto max-w-lg p-10" role="alert">
      <h1>Something went wrong</h1>
      <p className="mt-2 text-ink-soft">The page could not be shown. Nothing you saved was lost. Try again, and tell an admin if it keeps happening.</p>
      <button className="btn-primary mt-4" onClick={() => reset()}>Try again</button>
    </main>
  );
}
