import type { RoutineList } from "@/server/routines/contract";

/**
 * The routines the due engine could not plan on its last run: they have no work order, so no
 * reminder and no place in the Backlog, until their definition is put right.
 */
export function PlanProblems({ list }: { list: RoutineList }) {
  const problems = list.planProblems;
  if (problems.length === 0) return null;
  return (
    <section
      aria-labelledby="plan-problems-heading"
      className="rounded-md border border-alarm-300 bg-alarm-50 p-3 text-sm text-alarm-700 dark:border-alarm-700 dark:bg-alarm-700/15 dark:text-alarm-300"
    >
      <h2 id="plan-problems-heading" className="font-semibold">
        {problems.length === 1
          ? "1 routine cannot be planned"
          : `${problems.length} routines cannot be planned`}
      </h2>
      <p className="mt-0.5 text-xs">
        They have no work order and send no reminder until their definition is corrected.
        {list.canEdit ? " Edit each one below." : " Ask the chief engineer to correct them."}
      </p>
      <ul className="mt-2 space-y-1">
        {problems.map((p) => (
          <li key={p.id}>
            <span className="font-mono text-xs font-semibold">{p.componentCode}</span> {p.title}:{" "}
            <span className="font-medium">{p.reason}</span>
          </li>
        ))}
      </ul>
    </section>
  );
}
