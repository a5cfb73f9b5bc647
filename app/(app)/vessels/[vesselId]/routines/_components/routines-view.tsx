"use client";

import dynamic from "next/dynamic";
import { useDeferredValue, useState } from "react";
import { SidePanel } from "@/app/_components/forms/side-panel";
import { LoadProblem, Notice } from "@/app/_components/notice";
import { SearchField } from "@/app/_components/search-field";
import type { RoutineList, RoutineSummary } from "@/server/routines/contract";
import { CopyRoutine } from "./copy-routine";
import { RetireRoutine } from "./retire-routine";
import { RoutineParts } from "./routine-parts";
import { PlanProblems } from "./plan-problems";
import { RoutinesTable } from "./routines-table";
import { useRoutines } from "./use-routines";

// The editor's form libraries (react-hook-form, the zod contract) load when a routine is opened,
// not with the list: most visits read the list only.
const RoutineEditor = dynamic(() => import("./routine-editor").then((m) => m.RoutineEditor), {
  loading: () => <div className="h-64 animate-pulse rounded bg-ink-100 dark:bg-ink-850" aria-busy="true" />,
});

/** Which panel is open beside the list, and on which routine. */
export type Sheet = { kind: "add" } | { kind: "edit" | "copy" | "retire" | "parts"; routine: RoutineSummary };

export function RoutinesView({ vesselId }: { vesselId: string }) {
  const [component, setComponent] = useState("");
  const [text, setText] = useState("");
  const q = useDeferredValue(text.trim());
  const { data, error, isPending } = useRoutines(vesselId, component, q);
  const [sheet, setSheet] = useState<Sheet | null>(null);
  const [done, setDone] = useState<string | null>(null);

  if (isPending) return <ListSkeleton />;
  if (error) return <LoadProblem what="routines" error={error} />;

  const open = (next: Sheet) => {
    setDone(null);
    setSheet(next);
  };
  const close = () => setSheet(null);
  const finish = (message: string) => {
    setSheet(null);
    setDone(message);
  };

  return (
    <div className="grid gap-4">
      <div className="flex flex-wrap items-end gap-3">
        <div>
          <label htmlFor="routines-component" className="label">
            Component
          </label>
          <select
            id="routines-component"
            className="field w-64"
            value={component}
            onChange={(e) => setComponent(e.target.value)}
          >
            <option value="">All components</option>
            {data.components.map((c) => (
              <option key={c.id} value={c.id}>
                {c.code} — {c.name}
              </option>
            ))}
          </select>
        </div>
        <SearchField label="Search routines" placeholder="Title, code or name" value={text} onChange={setText} />
        <p className="mr-auto text-xs text-ink-500 dark:text-ink-400" aria-live="polite">
          {countWords(data)}
        </p>
        {data.canEdit && (
          <button type="button" className="btn-primary" onClick={() => open({ kind: "add" })}>
            Add routine
          </button>
        )}
      </div>
      <Notice message={done} />
      <PlanProblems list={data} />
      <RoutinesTable list={data} onAction={open} />
      {sheet && <SheetFor sheet={sheet} list={data} onDone={finish} onCancel={close} />}
    </div>
  );
}

function countWords(list: RoutineList): string {
  const shown = list.routines.length;
  if (list.total > shown)
    return `Showing the first ${shown} of ${list.total} routines: narrow the filter to see the rest.`;
  return `${list.total} ${list.total === 1 ? "routine" : "routines"}`;
}

type SheetProps = { sheet: Sheet; list: RoutineList; onDone: (m: string) => void; onCancel: () => void };

function SheetFor({ sheet, list, onDone, onCancel }: SheetProps) {
  const props = { list, onDone, onCancel };
  switch (sheet.kind) {
    case "add":
      return (
        <SidePanel title="Add a routine" subtitle={list.vessel.name} onClose={onCancel} wide>
          <RoutineEditor routineId={null} {...props} />
        </SidePanel>
      );
    case "edit":
      return (
        <SidePanel
          title={`Edit ${sheet.routine.title}`}
          subtitle={sheet.routine.component.code}
          onClose={onCancel}
          wide
        >
          <RoutineEditor routineId={sheet.routine.id} {...props} />
        </SidePanel>
      );
    case "copy":
      return (
        <SidePanel title="Copy routine" subtitle={sheet.routine.title} onClose={onCancel}>
          <CopyRoutine vesselId={list.vessel.id} routine={sheet.routine} onDone={onDone} onCancel={onCancel} />
        </SidePanel>
      );
    case "parts":
      return (
        <SidePanel title="Parts it needs" subtitle={sheet.routine.title} onClose={onCancel}>
          <RoutineParts vesselId={list.vessel.id} routine={sheet.routine} onDone={onDone} onCancel={onCancel} />
        </SidePanel>
      );
    case "retire":
      return (
        <SidePanel title="Retire routine" subtitle={sheet.routine.title} onClose={onCancel}>
          <RetireRoutine vesselId={list.vessel.id} routine={sheet.routine} onDone={onDone} onCancel={onCancel} />
        </SidePanel>
      );
  }
}

function ListSkeleton() {
  return (
    <div className="grid animate-pulse gap-2 panel p-4" aria-busy="true" aria-label="Loading the routines">
      {Array.from({ length: 10 }, (_, i) => (
        <div key={i} className="h-7 rounded bg-ink-100 dark:bg-ink-850" />
      ))}
    </div>
  );
}
