import { useId } from "react";
import type { RoutineCaution } from "@/db/schema";
import { CAUTION_WORDS as CAUTION, CAUTIONS_DEFER, NO_PARTICULAR_CAUTION } from "@/server/routines/caution-words";

export function Cautions({ cautions }: { cautions: readonly RoutineCaution[] }) {
  // One id per instance: the work-package sheet shows a cautions box for every job.
  const headingId = useId();
  return (
    <section
      aria-labelledby={headingId}
      className="rounded-lg border-2 border-brass-500 bg-brass-100/60 p-4 text-ink-900 dark:border-brass-500 dark:bg-brass-700/20 dark:text-ink-50 print:border-black print:bg-white"
    >
      <h2 id={headingId} className="flex items-center gap-2 text-base font-bold">
        <span aria-hidden="true">⚠</span> Before you start
      </h2>
      {cautions.length > 0 ? (
        <ul className="mt-2 grid gap-2 sm:grid-cols-2">
          {cautions.map((c) => (
            <li key={c}>
              <span className="font-semibold">{CAUTION[c].title}.</span> {CAUTION[c].text}
            </li>
          ))}
        </ul>
      ) : (
        <p className="mt-2">{NO_PARTICULAR_CAUTION}</p>
      )}
      <p className="mt-3 border-t border-brass-400 pt-2 text-sm font-medium dark:border-brass-500">
        {CAUTIONS_DEFER}
      </p>
    </section>
  );
}
