'use client';

/** Shown when a signed-in page fails: a plain message, never a stack trace. */
export default function AppError({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div className="card max-w-lg space-y-3" role="alert">
      <h1 className="text-xl font-bold">This page could not be loaded</h1>
      <p className="text-ink-soft">Something went wrong on our side, or the database is not answering. Your data is safe.</p>
      <button type="button" className="btn-primary" onClick={reset}>
        Try again
      </button>
    </div>
  );
}
