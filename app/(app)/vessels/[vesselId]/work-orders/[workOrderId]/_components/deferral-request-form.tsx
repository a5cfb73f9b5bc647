"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import { describedBy, Field } from "@/app/_components/forms/field";
import { FormActions } from "@/app/_components/forms/form-actions";
import { useSendForm } from "@/app/_components/forms/use-send-form";
import { type DeferralRequest, DeferralRequestInput, type WorkOrderWithDeferrals } from "@/server/deferrals/contract";
import { formatHours, formatShipDate } from "@/server/format/hours";
import { addShipDays, shipDateFromKey, shipDateKey } from "@/server/scheduling/ship-date";
import { useRequestDeferral } from "./use-work-order";
import { formatDayKey } from "@/server/format/dates";

const FIELDS = ["reason", "proposedDueDay", "proposedDueHours"] as const;

type Props = { detail: WorkOrderWithDeferrals; onDone: (message: string) => void };

/** The chief engineer's request: why, and the new limit; with the limits now and what follows. */
export function DeferralRequestForm({ detail, onDone }: Props) {
  const { deferrals: d, vessel, workOrder: w } = detail;
  const send = useRequestDeferral(vessel.id, w.id);
  const form = useForm<DeferralRequestInput, unknown, DeferralRequest>({
    resolver: zodResolver(DeferralRequestInput),
    defaultValues: { reason: "", proposedDueDay: "", proposedDueHours: "" },
  });
  const { register, formState } = form;
  const { errors, isSubmitting } = formState;
  const tomorrow = shipDateKey(addShipDays(shipDateFromKey(d.today), 1));
  const dueDay = d.current.dueDate ? formatShipDate(new Date(d.current.dueDate), vessel.timeZone) : null;

  const { onSubmit, problem } = useSendForm(form, {
    fields: FIELDS,
    outcome: "nothing was requested",
    send: async (values) => {
      const result = await send.mutateAsync(values);
      onDone(
        result.needsOffice
          ? `Deferral of ${w.number} requested: it awaits the technical superintendent’s decision.`
          : `Deferral of ${w.number} requested: you or the superintendent may decide it.`,
      );
    },
  });

  const described = (field: (typeof FIELDS)[number], hasHint = false) =>
    describedBy(`deferral-${field}`, errors[field]?.message, hasHint);

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      <section aria-label="Limits now" className="rounded-md bg-ink-50 p-3 text-sm dark:bg-ink-850">
        <p className="font-semibold">{d.current.deferred ? "Limit in force (deferred)" : "Limit now"}</p>
        <p className="tabular-nums">
          {dueDay ? `Due ${d.current.projected ? "≈ " : ""}${dueDay}` : "No due date"}
          {d.current.dueHours !== null && ` · at ${formatHours(d.current.dueHours)}`}
        </p>
        {d.current.projected && (
          <p className="text-ink-600 dark:text-ink-300">
            The date is projected from the running hours; the hours limit is the one in force.
          </p>
        )}
        {(d.grace.days !== null || d.grace.hours !== null) && (
          <p className="mt-1 text-ink-600 dark:text-ink-300">
            Grace now:{" "}
            {[d.grace.days !== null && `${d.grace.days} days`, d.grace.hours !== null && formatHours(d.grace.hours)]
              .filter(Boolean)
              .join(" / ")}{" "}
            past the due point.
          </p>
        )}
        <p className="mt-2 text-ink-600 dark:text-ink-300">
          Once approved, the tolerance rules measure from the new limit: the work order shows deferred until the window
          around it has passed, then late inside the grace and out of tolerance beyond it. A limit you leave blank stays
          as it is.
        </p>
      </section>
      <Field
        id="deferral-reason"
        label="Reason"
        error={errors.reason?.message}
        hint="What is missing or awaited (spares, a surveyor, a port stay), and why it is safe to wait."
      >
        <textarea className="field min-h-28" {...described("reason", true)} {...register("reason")} />
      </Field>
      <Field
        id="deferral-proposedDueDay"
        label="New due day (ship’s day)"
        error={errors.proposedDueDay?.message}
        hint={`After today and after the current due day; at most two years ahead (up to ${formatDayKey(d.latestDay)}).`}
      >
        <input
          type="date"
          className="field"
          min={tomorrow}
          max={d.latestDay}
          {...described("proposedDueDay", true)}
          {...register("proposedDueDay")}
        />
      </Field>
      {d.hasHoursLimit && (
        <Field
          id="deferral-proposedDueHours"
          label="New running-hours limit"
          error={errors.proposedDueHours?.message}
          hint={`Above ${formatHours(d.current.dueHours ?? 0)}${d.highestHours !== null ? `, at most ${formatHours(d.highestHours)} (one interval more)` : ""}.`}
        >
          <input
            inputMode="decimal"
            className="field tabular-nums"
            autoComplete="off"
            {...described("proposedDueHours", true)}
            {...register("proposedDueHours")}
          />
        </Field>
      )}
      <p className="text-sm text-ink-600 dark:text-ink-300">
        {d.needsOffice
          ? "This request goes to the technical superintendent: the work is critical or class-related, or your company has the office decide every deferral."
          : "Your company lets the chief engineer decide deferrals of work neither critical nor class-related; the decision is recorded with your name."}
      </p>
      <FormActions submitLabel="Send the request" busyLabel="Sending…" busy={isSubmitting} problem={problem} />
    </form>
  );
}
