"use client";

import Link from "next/link";
import { useState } from "react";
import { ProblemError } from "@/app/_components/fetch-json";
import { describedBy, Field } from "@/app/_components/forms/field";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { SidePanel } from "@/app/_components/forms/side-panel";
import { Notice } from "@/app/_components/notice";
import { StateBadge } from "@/app/_components/state-badge";
import type { CalendarWorkOrder } from "@/server/calendar/contract";
import { plannableDaysInWords } from "@/server/calendar/plannable-days";
import { formatHours } from "@/server/format/hours";
import { longDay } from "./calendar-days";
import { usePlanDate } from "./use-calendar";

type PlanPanelProps = {
  vesselId: string;
  workOrder: CalendarWorkOrder;
  canPlan: boolean;
  onClose: () => void;
  onSaved: (message: string) => void;
};

/** The keyboard's way to plan: the work order's facts, the days it may go on, and a date field. */
export function PlanPanel({ vesselId, workOrder: w, canPlan, onClose, onSaved }: PlanPanelProps) {
  const plan = usePlanDate(vesselId);
  const [day, setDay] = useState(w.plannedDate ?? "");
  const [fieldError, setFieldError] = useState<string | undefined>();
  const [problem, setProblem] = useState<string | null>(null);
  const plannable = w.state !== "done";
  const allowed = plannableDaysInWords(w);

  function save(plannedDate: string | null) {
    setFieldError(undefined);
    setProblem(null);
    plan.mutate(
      { workOrderId: w.id, plannedDate },
      {
        onSuccess: () => {
          onSaved(
            plannedDate ? `${w.number} is planned for ${longDay(plannedDate)}.` : `${w.number} has no planned date now.`,
          );
          onClose();
        },
        onError: (error) => {
          const onField =
            error instanceof ProblemError ? error.problem.errors?.find((e) => e.field === "plannedDate") : undefined;
          if (onField) setFieldError(onField.message);
          setProblem(onField ? "The plan was not changed." : problemSentence(error, "the plan was not changed"));
        },
      },
    );
  }

  return (
    <SidePanel title={`${w.number} ${w.title}`} subtitle={`${w.component.code} · ${w.component.name}`} onClose={onClose}>
      <dl className="mb-4 grid grid-cols-[8rem_1fr] gap-x-3 gap-y-2 text-sm">
        <dt className="text-ink-500 dark:text-ink-400">State</dt>
        <dd>
          <StateBadge state={w.state} />
          {w.pendingDeferral && <span className="ml-2 text-xs">deferral requested</span>}
        </dd>
        <dt className="text-ink-500 dark:text-ink-400">{w.state === "deferred" ? "Deferred to" : "Computed due"}</dt>
        <dd>
          {w.dueDay ? longDay(w.dueDay) : "not known yet"}
          {w.projected && <span className="ml-1 kc-mark kc-mark-projected">≈ projected</span>}
          {w.basis && <span className="mt-0.5 block text-xs text-ink-600 dark:text-ink-300">{w.basis}</span>}
        </dd>
        {w.doneDay && (
          <>
            <dt className="text-ink-500 dark:text-ink-400">Done</dt>
            <dd>{longDay(w.doneDay)}</dd>
          </>
        )}
        <dt className="text-ink-500 dark:text-ink-400">Planned</dt>
        <dd>{w.plannedDate ? longDay(w.plannedDate) : "not planned"}</dd>
        {plannable && (
          <>
            <dt className="text-ink-500 dark:text-ink-400">May be planned</dt>
            <dd>{allowed}</dd>
          </>
        )}
        <dt className="text-ink-500 dark:text-ink-400">Work</dt>
        <dd>
          {formatHours(w.estimatedManHours)} of {w.rank.replaceAll("-", " ")}
          {w.needsEngineStop && " · engine stopped"}
          {w.critical && " · critical"}
          {w.classRelated && " · class item"}
        </dd>
      </dl>

      {plannable && canPlan && (
        <form
          noValidate
          className="grid gap-4"
          onSubmit={(event) => {
            event.preventDefault();
            if (!day) {
              setFieldError("Choose a day, or use Clear planned date.");
              return;
            }
            save(day);
          }}
        >
          <Field
            id="planned-date"
            label="Planned date"
            hint={`A ship’s day ${allowed}. The computed due date stays as it is.`}
            error={fieldError}
          >
            <input
              type="date"
              className="field"
              value={day}
              min={w.planFrom ?? undefined}
              max={w.planUntil ?? undefined}
              onChange={(event) => setDay(event.target.value)}
              {...describedBy("planned-date", fieldError, true)}
            />
          </Field>
          <div className="grid gap-3 border-t border-ink-200 pt-4 dark:border-ink-800">
            <Notice tone="problem" message={problem} />
            <div className="flex flex-wrap gap-2">
              <button type="submit" className="btn-primary" disabled={plan.isPending}>
                {plan.isPending ? "Saving…" : "Save planned date"}
              </button>
              {w.plannedDate && (
                <button type="button" className="btn-quiet" disabled={plan.isPending} onClick={() => save(null)}>
                  Clear planned date
                </button>
              )}
            </div>
          </div>
        </form>
      )}
      {plannable && !canPlan && (
        <p className="text-sm text-ink-600 dark:text-ink-300">The chief engineer plans work orders on a day.</p>
      )}
      <p className="mt-4 text-sm">
        <Link
          href={`/vessels/${vesselId}/work-orders/${w.id}`}
          className="font-semibold text-tide-700 underline-offset-2 hover:underline dark:text-tide-300"
        >
          Open work order {w.number}
        </Link>
      </p>
    </SidePanel>
  );
}
