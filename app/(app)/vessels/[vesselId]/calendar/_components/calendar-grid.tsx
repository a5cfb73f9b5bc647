"use client";

// FullCalendar on the client only (calendar-view imports this file with ssr: false). Every day is a
// ship's day: the calendar runs in UTC with all-day events, so the browser's own zone never moves a
// work order to another day, and "today" is the ship's today.
import type { DatesSetArg, EventClickArg, EventContentArg, EventDropArg, EventInput } from "@fullcalendar/core";
import dayGridPlugin from "@fullcalendar/daygrid";
import interactionPlugin from "@fullcalendar/interaction";
import listPlugin from "@fullcalendar/list";
import FullCalendar from "@fullcalendar/react";
import { useMemo } from "react";
import { StateBadge } from "@/app/_components/state-badge";
import type { CalendarRange, CalendarWorkOrder } from "@/server/calendar/contract";
import { shortDay } from "./calendar-days";
import type { VisibleRange } from "./use-calendar";

type CalendarGridProps = {
  data: CalendarRange | undefined;
  today: string;
  canPlan: boolean;
  onRange: (range: VisibleRange) => void;
  onOpen: (workOrder: CalendarWorkOrder) => void;
  onMove: (workOrder: CalendarWorkOrder, day: string, revert: () => void) => void;
};

function nextDay(day: string): string {
  return new Date(Date.parse(`${day}T00:00:00Z`) + 86_400_000).toISOString().slice(0, 10);
}

export function CalendarGrid({ data, today, canPlan, onRange, onOpen, onMove }: CalendarGridProps) {
  const events = useMemo<EventInput[]>(() => {
    if (!data) return [];
    const stays: EventInput[] = data.portStays.map((s) => ({
      id: `stay-${s.id}`,
      title: `Port stay: ${s.port}`,
      start: s.firstDay,
      end: nextDay(s.lastDay),
      allDay: true,
      display: "background",
      classNames: ["kc-port-stay"],
    }));
    // The server's order (day, then most urgent first) is the order inside a day.
    const work: EventInput[] = data.workOrders.map((w, position) => ({
      id: w.id,
      title: `${w.number} ${w.title}`,
      start: w.day,
      allDay: true,
      editable: canPlan && w.state !== "done",
      classNames: ["kc-event", `kc-state-${w.state}`],
      extendedProps: { workOrder: w, position },
    }));
    return [...stays, ...work];
  }, [data, canPlan]);

  return (
    <FullCalendar
      plugins={[dayGridPlugin, listPlugin, interactionPlugin]}
      initialView="dayGridMonth"
      initialDate={today}
      now={today}
      timeZone="UTC"
      firstDay={1}
      height="auto"
      headerToolbar={{ left: "prev,next today", center: "title", right: "dayGridMonth,listMonth" }}
      // Words, not FullCalendar's chevron icons: an icon is an unnamed role="img" inside the button,
      // which axe reports, and a word is easier to hit and to read on a tablet.
      buttonText={{ prev: "Previous", next: "Next", today: "Today", month: "Month grid", list: "List" }}
      buttonHints={{ prev: "Previous month", next: "Next month", today: "Go to today’s month" }}
      viewHint="Show as $0"
      dayMaxEvents={4}
      moreLinkText={(n) => `${n} more`}
      // FullCalendar draws "N more" as an <a> with aria-expanded but no role: a link cannot be
      // expanded (axe, aria-allowed-attr). It opens a popover, so it is a button.
      moreLinkDidMount={(arg) => arg.el.setAttribute("role", "button")}
      // The list's time column would say one word for every row; the row's own marks say whether
      // its day is the due day, a planned day or a projection.
      views={{ listMonth: { displayEventTime: false } }}
      noEventsContent="No work falls due in this month."
      editable={canPlan}
      eventDurationEditable={false}
      eventStartEditable={canPlan}
      events={events}
      eventOrder="position"
      datesSet={(arg: DatesSetArg) => onRange({ start: arg.startStr.slice(0, 10), end: arg.endStr.slice(0, 10) })}
      eventClick={(arg: EventClickArg) => {
        arg.jsEvent.preventDefault();
        const w = arg.event.extendedProps.workOrder as CalendarWorkOrder | undefined;
        if (w) onOpen(w);
      }}
      eventDrop={(arg: EventDropArg) => {
        const w = arg.event.extendedProps.workOrder as CalendarWorkOrder | undefined;
        if (w && arg.event.startStr) onMove(w, arg.event.startStr.slice(0, 10), arg.revert);
        else arg.revert();
      }}
      eventDidMount={(arg) => {
        const w = arg.event.extendedProps.workOrder as CalendarWorkOrder | undefined;
        if (w?.basis) arg.el.setAttribute("aria-describedby", `basis-${w.id}-${arg.view.type}`);
        if (w) arg.el.setAttribute("data-work-order", w.number);
      }}
      eventContent={(arg: EventContentArg) => {
        const w = arg.event.extendedProps.workOrder as CalendarWorkOrder | undefined;
        if (!w) return <span className="kc-stay-label">{arg.event.title}</span>;
        return <WorkOrderEvent workOrder={w} viewType={arg.view.type} />;
      }}
    />
  );
}

function WorkOrderEvent({ workOrder: w, viewType }: { workOrder: CalendarWorkOrder; viewType: string }) {
  // The month grid's event is itself focusable (FullCalendar's eventClick makes it so); the list
  // view drops that anchor when the content is ours, so there a button opens the panel: its click,
  // from a pointer or from Enter, reaches eventClick through the row.
  const Body = viewType.startsWith("list") ? "button" : "span";
  return (
    <Body className="kc-event-body" {...(Body === "button" ? { type: "button" as const } : {})}>
      <span className="kc-event-line">
        <StateBadge state={w.state} />
        <span className="kc-event-number">{w.number}</span>
      </span>
      <span className="kc-event-title">{w.title}</span>
      {(w.projected || w.plannedDate || w.pendingDeferral || Body === "button") && (
        <span className="kc-event-marks">
          {Body === "button" && !w.plannedDate && !w.projected && (
            <span className="kc-mark">{w.state === "deferred" ? "deferred to" : "due"}</span>
          )}
          {w.plannedDate && (
            <span className="kc-mark kc-mark-planned">
              planned{w.dueDay && w.dueDay !== w.plannedDate ? ` · due ${shortDay(w.dueDay)}` : ""}
            </span>
          )}
          {w.projected && <span className="kc-mark kc-mark-projected">≈ projected</span>}
          {w.pendingDeferral && <span className="kc-mark">deferral asked</span>}
        </span>
      )}
      {w.basis && (
        <span id={`basis-${w.id}-${viewType}`} role="tooltip" className="kc-basis">
          {w.basis}
        </span>
      )}
    </Body>
  );
}
