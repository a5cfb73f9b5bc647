"use client";
// The defect report a corrective work order repairs: what was found, when and by whom, what it
// affects, and once closed, its cause and the action against a repeat.
import { formatShipTime } from "@/server/format/hours";
import { DEFECT_STATE_WORDS, type DefectView } from "@/server/defects/contract";

export function defectFlags(d: Pick<DefectView, "affectsCritical" | "affectsSafety" | "affectsClass" | "needsEngineStop">): string[] {
  return [
    d.affectsCritical && "critical equipment",
    d.affectsSafety && "safety",
    d.affectsClass && "class",
    d.needsEngineStop && "engine stop to repair",
  ].filter((f): f is string => Boolean(f));
}

export function DefectReport({ defect: d, timeZone }: { defect: DefectView; timeZone: string }) {
  const flags = defectFlags(d);
  return (
    <section aria-labelledby="defect-heading" className="panel p-4">
      <h2 id="defect-heading" className="text-base font-semibold">
        Defect report <span className="font-mono">{d.number}</span> · {DEFECT_STATE_WORDS[d.state]}
      </h2>
      <p className="mt-1 font-medium">{d.title}</p>
      {d.description && <p className="mt-1 max-w-prose whitespace-pre-line">{d.description}</p>}
      <dl className="mt-3 grid grid-cols-2 gap-x-6 gap-y-2 text-sm sm:grid-cols-4">
        <div>
          <dt className="label">Found</dt>
          <dd>{formatShipTime(new Date(d.foundAt), timeZone)} ship’s time</dd>
        </div>
        <div>
          <dt className="label">{d.source === "measurement" ? "Raised by the values of" : "Reported by"}</dt>
          <dd>{d.reportedBy ?? "—"}</dd>
        </div>
        <div>
          <dt className="label">Affects</dt>
          <dd>{flags.length ? flags.join(", ") : "—"}</dd>
        </div>
        <div>
          <dt className="label">Target day</dt>
          <dd>{d.targetDay ?? "not planned yet"}</dd>
        </div>
      </dl>
      {d.state === "closed" && (
        <dl className="mt-3 grid gap-2 text-sm sm:grid-cols-2">
          <div>
            <dt className="label">Cause</dt>
            <dd className="whitespace-pre-line">{d.cause}</dd>
          </div>
          <div>
            <dt className="label">Action against a repeat</dt>
            <dd className="whitespace-pre-line">{d.action}</dd>
          </div>
        </dl>
      )}
    </section>
  );
}
