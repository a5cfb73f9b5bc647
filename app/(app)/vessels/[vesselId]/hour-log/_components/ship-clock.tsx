"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { type FormEvent, useState } from "react";
import { fetchJson, ProblemError } from "@/app/_components/fetch-json";
import { FormActions } from "@/app/_components/forms/form-actions";
import { queryKeys } from "@/app/_components/query-keys";
import { shipClock, shipDay } from "@/server/format/hours";
import type { ShipClockView } from "@/server/vessels/clock-contract";
import { CLOCK_OFFSETS, offsetZone, zoneWords } from "@/server/vessels/clock-rules";

const offsetLabel = (h: number) => zoneWords(offsetZone(h));

/**
 * The ship's clock on the Hour log: the zone kept now, the changes on passage, and for the chief
 * engineer a form to enter the next one ("clocks back 1 h at midnight"). From the change on, the
 * ship's days and the Hour log's times follow the new zone.
 */
export function ShipClock({ vesselId }: { vesselId: string }) {
  const queryClient = useQueryClient();
  const clock = useQuery({
    queryKey: queryKeys.shipClock(vesselId),
    queryFn: () => fetchJson<ShipClockView>(`/api/vessels/${vesselId}/clock`),
  });
  const now = new Date();
  const zone = clock.data?.zone ?? "UTC";
  const [day, setDay] = useState("");
  const [time, setTime] = useState("00:00");
  const [target, setTarget] = useState("");
  const [note, setNote] = useState("");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [done, setDone] = useState<string | null>(null);

  const add = useMutation({
    mutationFn: (body: unknown) =>
      fetchJson<ShipClockView>(`/api/vessels/${vesselId}/clock`, { method: "POST", body: JSON.stringify(body) }),
    onSuccess: (view) => {
      queryClient.setQueryData(queryKeys.shipClock(vesselId), view);
      // The zone may have moved now: the Hour log's days and times follow it.
      void queryClient.invalidateQueries({ queryKey: queryKeys.hourLog(vesselId) });
      const latest = view.changes[0];
      setDone(latest ? `${latest.move} on ${latest.effectiveWords}: the ship keeps ${latest.toZone} from then on.` : "Saved.");
      setErrors({});
      setNote("");
    },
    onError: (error) => {
      if (error instanceof ProblemError && error.problem.errors?.length) {
        setErrors(Object.fromEntries(error.problem.errors.map((e) => [e.field.split(".")[0] ?? e.field, e.message])));
      } else setErrors({ form: error.message });
    },
  });

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    setDone(null);
    add.mutate({ shipDay: day || shipDay(now, zone), time, zone: target, note });
  };

  const describe = (field: string) =>
    errors[field] ? { "aria-invalid": true as const, "aria-describedby": `clock-${field}-error` } : {};

  return (
    <details className="panel p-4" aria-labelledby="ship-clock-summary">
      <summary id="ship-clock-summary" className="cursor-pointer py-1 font-semibold">
        Ship’s clock: {clock.data ? clock.data.zoneWords : "…"}
        <span className="ml-2 text-sm font-normal text-ink-500 dark:text-ink-400">
          {clock.data ? `${shipClock(now, zone)} on board now` : ""}
        </span>
      </summary>
      <div className="mt-3 grid gap-4 lg:grid-cols-2">
        <div>
          <h3 className="text-sm font-semibold">Changes on passage</h3>
          {clock.data && clock.data.changes.length === 0 && (
            <p className="text-sm text-ink-500">No change entered: the ship has kept {clock.data.zoneWords} in Keelson.</p>
          )}
          <ol className="mt-1 space-y-1 text-sm">
            {clock.data?.changes.map((c) => (
              <li key={c.id}>
                <span className="tabular-nums">{c.effectiveWords}</span>: {c.move}, {c.fromZone} → {c.toZone}
                {c.inForce ? "" : " (to come)"}
                {c.by ? <span className="text-ink-500"> · {c.by}</span> : null}
                {c.note ? <span className="block text-xs text-ink-500">{c.note}</span> : null}
              </li>
            ))}
          </ol>
        </div>
        {clock.data?.canSet && (
          <form onSubmit={onSubmit} noValidate className="grid gap-2 text-sm" aria-label="Enter a change of the clock">
            <p className="text-ink-600 dark:text-ink-300">
              Enter the change when the master orders it. The day and time are read on the clock kept before the change;
              a day of 25 or 23 hours follows, and readings across it are accepted as they are.
            </p>
            <div className="flex flex-wrap gap-2">
              <label className="grid gap-1">
                <span className="label">Ship’s day</span>
                <input type="date" className="field" value={day || shipDay(now, zone)} onChange={(e) => setDay(e.target.value)} {...describe("shipDay")} />
              </label>
              <label className="grid gap-1">
                <span className="label">Time</span>
                <input type="time" className="field" value={time} onChange={(e) => setTime(e.target.value)} {...describe("time")} />
              </label>
              <label className="grid gap-1">
                <span className="label">New zone</span>
                <select className="field" value={target} onChange={(e) => setTarget(e.target.value)} {...describe("zone")}>
                  <option value="">Pick…</option>
                  {CLOCK_OFFSETS.map((h) => (
                    <option key={h} value={offsetLabel(h).replace("−", "-")}>
                      {offsetLabel(h)}
                    </option>
                  ))}
                </select>
              </label>
            </div>
            <label className="grid gap-1">
              <span className="label">Note (optional)</span>
              <input className="field" value={note} maxLength={300} onChange={(e) => setNote(e.target.value)} placeholder="e.g. Westbound, Indian Ocean" />
            </label>
            {Object.entries(errors)
              .filter(([field]) => field !== "form")
              .map(([field, message]) => (
                <p key={field} id={`clock-${field}-error`} className="field-error" role="alert">
                  {message}
                </p>
              ))}
            {done && (
              <p role="status" className="text-go-700 dark:text-go-300">
                {done}
              </p>
            )}
            <FormActions submitLabel="Enter the change" busy={add.isPending} problem={errors.form ?? null} />
          </form>
        )}
      </div>
    </details>
  );
}
