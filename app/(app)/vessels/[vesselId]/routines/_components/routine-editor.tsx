"use client";

import { LoadProblem } from "@/app/_components/notice";
import { RecordTrail } from "@/app/_components/record-trail";
import type { RoutineList } from "@/server/routines/contract";
import { RoutineForm } from "./routine-form";
import { useRoutine } from "./use-routines";

type Props = { list: RoutineList; routineId: string | null; onDone: (m: string) => void; onCancel: () => void };

/** The form for a new routine, or for a stored one once its whole definition has loaded. */
export function RoutineEditor({ list, routineId, onDone, onCancel }: Props) {
  if (!routineId) return <RoutineForm list={list} routine={null} onDone={onDone} onCancel={onCancel} />;
  return <StoredRoutine list={list} routineId={routineId} onDone={onDone} onCancel={onCancel} />;
}

function StoredRoutine({ list, routineId, onDone, onCancel }: Props & { routineId: string }) {
  const { data, error, isPending } = useRoutine(list.vessel.id, routineId);
  if (isPending) return <p aria-busy="true">Loading the routine…</p>;
  if (error) return <LoadProblem what="routine" error={error} />;
  return (
    <>
      <RoutineForm list={list} routine={data} onDone={onDone} onCancel={onCancel} />
      <div className="mt-4">
        <RecordTrail vesselId={list.vessel.id} table="routine" record={routineId} />
      </div>
    </>
  );
}
