"use client";

export default function AppErrorPage({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <main className="mx-auto flex min-h-[60vh] max-w-md flex-col items-start justify-center gap-3 px-4">
      <h1 className="text-lg font-bold">This page could not be shown</h1>
      <p className="text-ink-600 dark:text-ink-300">
        Something went wrong on the server. Nothing you entered was lost unless a message said so. Try again; if it
        keeps happening, tell your company administrator the time it happened.
      </p>
      <button type="button" className="btn-primary" onClick={reset}>
        Try again
      </button>
    </main>
  );
}
