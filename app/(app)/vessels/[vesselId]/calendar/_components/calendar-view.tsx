"use client";

import dynamic from "next/dynamic";
import { useCallback, useState } from "react";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { LoadProblem, Notice } from "@/app/_components/notice";
import type { CalendarWorkOrder } from "@/server/calendar/contract";
import { longDay, shipToday } from "./calendar-days";
import { PlanPanel } from "./plan-panel";
import { PortStaysInView } from "./port-stays-in-view";
import { usePlanDate, useCalendar, type VisibleRange } from "./use-calendar";

// FullCalendar measures the page and injects its CSS from its JS: it renders on the client only.
const CalendarGrid = dynamic(() => import("./calendar-grid").then((m) => m.CalendarGrid), {
  ssr: false,
  loading: () => <div className="h-[36rem] animate-pulse rounded-md bg-ink-100 dark:bg-ink-850" aria-busy="true" />,
});

type CalendarViewProps = { vesselId: string; timeZone: string; canPlan: boolean };

export function CalendarView({ vesselId, timeZone, canPlan }: CalendarViewProps) {
  const [today] = useState(() => shipToday(timeZone));
  const [range, setRange] = useState<VisibleRange | null>(null);
  const [openId, setOpenId] = useState<string | null>(null);
  const [notice, setNotice] = useState<{ tone: "done" | "problem"; message: string } | null>(null);
  const calendar = useCalendar(vesselId, range);
  const plan = usePlanDate(vesselId);

  const onRange = useCallback(
    (next: VisibleRange) =>
      setRange((current) => (current?.start === next.start && current.end === next.end ? current : next)),
    [],
  );
  const onMove = useCallback(
    (w: CalendarWorkOrder, day: string, revert: () => void) => {
      setNotice(null);
      plan.mutate(
        { workOrderId: w.id, plannedDate: day },
        {
          onSuccess: () => setNotice({ tone: "done", message: `${w.number} is planned for ${longDay(day)}.` }),
          onError: (error) => {
            revert();
            setNotice({ tone: "problem", message: problemSentence(error, "the plan was not changed") });
          },
        },
      );
    },
    [plan],
  );

  const data = calendar.data;
  const open = openId ? data?.workOrders.find((w) => w.id === openId) : undefined;
  const empty = data && !calendar.isPlaceholderData && data.workOrders.length === 0 && data.portStays.length === 0;

  return (
    <div className="grid gap-4 lg:grid-cols-[1fr_16rem]">
      <section aria-labelledby="calendar-heading" className="panel min-w-0 p-3 sm:p-4">
        <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="calendar-heading" className="text-base font-semibold">
            Due work and port stays
          </h2>
          <p className="text-xs text-ink-500 dark:text-ink-400">
            Ship’s days in {timeZone}
            {canPlan ? " · drag a work order, or open it, to plan it on a day inside its window" : ""}
          </p>
        </div>
        <Notice tone={notice?.tone} message={notice?.message ?? null} className="mb-2 text-sm" />
        {calendar.error && <LoadProblem what="calendar" error={calendar.error} />}
        <p aria-live="polite" className="mb-2 text-sm text-ink-600 empty:hidden dark:text-ink-300">
          {calendar.isFetching && !data ? "Loading the calendar…" : ""}
          {empty ? "Nothing falls due in these weeks and no port stay is planned. Use Previous and Next to look further." : ""}
        </p>
        <div className="kc-calendar" aria-busy={calendar.isFetching}>
          <CalendarGrid
            data={data}
            today={today}
            canPlan={canPlan}
            onRange={onRange}
            onOpen={(w) => setOpenId(w.id)}
            onMove={onMove}
          />
        </div>
        <Legend />
      </section>
      <PortStaysInView vesselId={vesselId} stays={data?.portStays} loading={!data && !calendar.error} />
      {open && (
        <PlanPanel
          vesselId={vesselId}
          workOrder={open}
          canPlan={canPlan}
          onClose={() => setOpenId(null)}
          onSaved={(message) => setNotice({ tone: "done", message })}
        />
      )}
    </div>
  );
}

function Legend() {
  return (
    <p className="mt-3 flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-600 dark:text-ink-300">
      <span>
        <span className="kc-mark kc-mark-projected">≈ projected</span> due day projected from running hours
      </span>
      <span>
        <span className="kc-mark kc-mark-planned">planned</span> on the chief’s planned day, computed due beside it
      </span>
      <span>
        <span className="kc-legend-stay" aria-hidden="true" /> port stay
      </span>
    </p>
  );
}
