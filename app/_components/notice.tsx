// The line that says what just happened, read out by screen readers as it changes: a change done
// (green), or a problem (alarm colour, announced at once).

const TONE = {
  done: "bg-go-50 text-go-700 dark:bg-go-700/20 dark:text-go-300",
  problem: "bg-alarm-50 text-alarm-700 dark:bg-alarm-700/20 dark:text-alarm-300",
} as const;

type NoticeProps = {
  message: string | null;
  tone?: keyof typeof TONE;
  /** Spacing around the notice; it takes no room while there is nothing to say. */
  className?: string;
};

export function Notice({ message, tone = "done", className }: NoticeProps) {
  return (
    <div aria-live="polite" className={className ? `empty:hidden ${className}` : "empty:hidden"}>
      {message && (
        <p role={tone === "problem" ? "alert" : undefined} className={`rounded-md px-3 py-2 font-medium ${TONE[tone]}`}>
          {message}
        </p>
      )}
    </div>
  );
}

/** In place of a view whose data did not arrive. */
export function LoadProblem({ what, error }: { what: string; error: Error }) {
  return (
    <p role="alert" className="panel p-4 text-alarm-700 dark:text-alarm-300">
      The {what} could not be loaded: {error.message}
    </p>
  );
}
