import { useId } from "react";
import type { RoutineCaution } from "@/db/schema";

// Keelson's own wording of the usual precautions; the ship's safety management system has the procedure.
const CAUTION: Record<RoutineCaution, { title: string; text: string }> = {
  isolation: {
    title: "Isolate and lock out",
    text: "Stop the machinery, isolate its power, fuel, oil, steam and air, lock and tag every isolation, and prove it dead before opening anything.",
  },
  "permit-to-work": {
    title: "Permit to work",
    text: "Get the permit issued and signed by the responsible officer before starting; close it out when the job is boxed up.",
  },
  "enclosed-space": {
    title: "Enclosed space",
    text: "Ventilate, test the atmosphere, post a standby at the entrance and keep to the entry permit before anyone goes in.",
  },
  "hot-work": {
    title: "Hot work",
    text: "Hot-work permit, combustibles cleared, fire watch posted and an extinguisher at hand, during the work and after it.",
  },
  "starting-air": {
    title: "Starting air",
    text: "Shut the main starting valve and the starting-air supply, vent the line, and block and tag the valves against opening.",
  },
  "turning-gear": {
    title: "Turning gear",
    text: "Engage the turning gear and post a warning at every control stand so nobody can start or turn the engine while people work inside it.",
  },
};

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
        <p className="mt-2">
          No particular precautions are listed for this job; keep to the ship’s usual safe practice.
        </p>
      )}
      <p className="mt-3 border-t border-brass-400 pt-2 text-sm font-medium dark:border-brass-500">
        Keelson plans and records; the maker’s instruction manual, local regulations and class requirements prevail.
      </p>
    </section>
  );
}
