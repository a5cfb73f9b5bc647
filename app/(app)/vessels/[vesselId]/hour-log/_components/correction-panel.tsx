"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { describedBy, Field } from "@/app/_components/forms/field";
import { FormActions } from "@/app/_components/forms/form-actions";
import { useSendForm } from "@/app/_components/forms/use-send-form";
import { SidePanel } from "@/app/_components/forms/side-panel";
import { formatHours, formatShipTime } from "@/server/format/hours";
import type { HistoryReading } from "@/server/readings/contract";
import { MeterValue } from "@/server/readings/contract";
import { type Neighbour, readingProblem } from "@/server/readings/rules";
import { CorrectionForm, type CorrectionFormOutput, type CorrectionFormValues } from "./hour-log-form";
import { useCorrectReading, useRemoveReading } from "./use-hour-log";

const FIELDS = ["value", "remark", "reason"] as const;

type Props = {
  vesselId: string;
  counterName: string;
  reading: HistoryReading;
  /** The readings of the same meter either side, where the history shows them: for the live check. */
  neighbours: { previous: Neighbour | null; next: Neighbour | null };
  timeZone: string;
  onDone: (message: string) => void;
  onClose: () => void;
};

/** Corrects a mistyped reading's value, or removes it, always with a reason for the audit trail. */
export function CorrectionPanel({ vesselId, counterName, reading, neighbours, timeZone, onDone, onClose }: Props) {
  const readAt = new Date(reading.readAt);
  const when = formatShipTime(readAt, timeZone);
  const correct = useCorrectReading(vesselId);
  const remove = useRemoveReading(vesselId);
  const [confirming, setConfirming] = useState(false);
  const form = useForm<CorrectionFormValues, unknown, CorrectionFormOutput>({
    resolver: zodResolver(CorrectionForm),
    defaultValues: { remove: false, value: String(reading.meterValue), remark: reading.remark ?? "", reason: "" },
  });
  const { register, formState, control } = form;
  const { errors, isSubmitting } = formState;
  const [removing, raw] = useWatch({ control, name: ["remove", "value"] });

  // The server's check while typing, against the neighbours the history shows (it has the last word).
  const parsed = !removing && raw.trim() ? MeterValue.safeParse(raw) : null;
  const liveProblem =
    parsed?.success && parsed.data !== reading.meterValue
      ? readingProblem(
          { name: counterName, segmentStartedAt: null, ...neighbours, existingAtSameInstant: null },
          parsed.data,
          readAt,
          timeZone,
        )
      : null;
  const valueError = errors.value?.message ?? liveProblem ?? undefined;

  const { onSubmit, problem } = useSendForm(form, {
    fields: FIELDS,
    outcome: (values) => (values.remove ? "nothing was removed" : "nothing was changed"),
    send: async (values) => {
      if (values.remove && !confirming) {
        setConfirming(true);
        return;
      }
      if (values.remove) {
        await remove
          .mutateAsync({ readingId: reading.id, input: { reason: values.reason } })
          .catch((error: unknown) => {
            // A refused removal asks again before the next attempt.
            setConfirming(false);
            throw error;
          });
        onDone(
          `Removed the reading of ${counterName} at ${when} (${formatHours(reading.meterValue)}); the audit trail keeps it with your reason.`,
        );
      } else {
        const result = await correct.mutateAsync({
          readingId: reading.id,
          input: { value: values.value, remark: values.remark, reason: values.reason },
        });
        const after = result.reading?.meterValue ?? reading.meterValue;
        onDone(
          after === reading.meterValue
            ? `Changed the remark of the ${counterName} reading at ${when}.`
            : `Corrected the ${counterName} reading at ${when}: ${formatHours(reading.meterValue)} → ${formatHours(after)}.`,
        );
      }
    },
  });

  return (
    <SidePanel
      title="Correct a reading"
      subtitle={`${counterName} · ${when} ship’s time`}
      onClose={onClose}
      closeOnBackdrop
    >
      <form onSubmit={onSubmit} noValidate className="grid gap-4">
        <p className="text-ink-700 dark:text-ink-200">
          Stored: <span className="font-semibold tabular-nums">{formatHours(reading.meterValue)}</span>
          {reading.totalHours !== reading.meterValue && (
            <span className="text-ink-500 dark:text-ink-400"> (total {formatHours(reading.totalHours)})</span>
          )}
          {reading.remark && (
            <span className="block text-xs text-ink-500 dark:text-ink-400">Remark: {reading.remark}</span>
          )}
        </p>

        {!removing && (
          <>
            <Field
              id="correction-value"
              label="Corrected value (h)"
              hint="What the meter showed at that time."
              error={valueError}
            >
              <input
                className="field w-40 text-right tabular-nums"
                inputMode="decimal"
                autoComplete="off"
                {...describedBy("correction-value", valueError, true)}
                {...register("value")}
              />
            </Field>
            <Field id="correction-remark" label="Remark (optional)" error={errors.remark?.message}>
              <input
                className="field"
                autoComplete="off"
                {...describedBy("correction-remark", errors.remark?.message)}
                {...register("remark")}
              />
            </Field>
          </>
        )}

        <Field
          id="correction-reason"
          label="Reason"
          hint="Kept in the reading’s audit trail with your name, the time and the old value."
          error={errors.reason?.message}
        >
          <textarea
            rows={2}
            className="field"
            placeholder="e.g. Typed 41,250 for 14,250"
            {...describedBy("correction-reason", errors.reason?.message, true)}
            {...register("reason")}
          />
        </Field>

        <label className="flex items-start gap-2">
          <input
            type="checkbox"
            className="mt-0.5 accent-alarm-600"
            {...register("remove", { onChange: () => setConfirming(false) })}
          />
          <span>
            <span className="font-medium">Remove this reading</span>
            <span className="block text-xs text-ink-500 dark:text-ink-400">
              For a reading entered on the wrong counter or twice. The readings either side must still agree.
            </span>
          </span>
        </label>

        <p className="text-xs text-ink-500 dark:text-ink-400">
          Only the value and the remark can be corrected. To move a reading to another time, remove it and enter it
          again at the right time in the form above.
        </p>

        {confirming && removing && (
          <p
            role="alert"
            className="rounded-md border border-alarm-300 bg-alarm-50 px-3 py-2 text-alarm-700 dark:border-alarm-700 dark:bg-alarm-700/20 dark:text-alarm-300"
          >
            Remove {formatHours(reading.meterValue)} at {when}? The reading leaves the Hour log and the due dates are
            worked out again without it. Press the button again to remove it, or untick the box to keep it.
          </p>
        )}

        <FormActions
          submitLabel={removing ? (confirming ? "Yes, remove this reading" : "Remove reading…") : "Save correction"}
          busyLabel={removing ? "Removing…" : "Saving…"}
          busy={isSubmitting}
          problem={problem}
          onCancel={onClose}
          danger={removing}
        />
      </form>
    </SidePanel>
  );
}
