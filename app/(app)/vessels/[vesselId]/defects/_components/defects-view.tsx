"use client";
// The vessel's defect reports: open ones first (those on critical equipment first, then the
// oldest), with their state, target day and age. Anyone on board with write access reports one;
// the chief engineer plans it; its repair is recorded and approved on its work order.
import Link from "next/link";
import { useState } from "react";
import { SidePanel } from "@/app/_components/forms/side-panel";
import { LoadProblem } from "@/app/_components/notice";
import { DEFECT_STATE_WORDS, type DefectView } from "@/server/defects/contract";
import { formatShipTime, shipDay } from "@/server/format/hours";
import { defectFlags } from "../../work-orders/[workOrderId]/_components/defect-report";
import { PlanForm } from "./plan-form";
import { ReportForm } from "./report-form";
import { useDefects } from "./use-defects";

const LINK = "text-tide-700 underline-offset-2 hover:underline dark:text-tide-300";

export function DefectsView({ vesselId }: { vesselId: string }) {
  const [state, setState] = useState<"open" | "all">("open");
  const { data, error } = useDefects(vesselId, state);
  const [panel, setPanel] = useState<"report" | DefectView | null>(null);
  const [notice, setNotice] = useState<React.ReactNode>(null);
  if (error) return <LoadProblem what="defect reports" error={error} />;
  if (!data) return <div className="h-64 animate-pulse panel" aria-busy="true" aria-label="Loading the defect reports" />;
  const tz = data.vessel.timeZone;

  return (
    <div className="grid gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-xl font-bold">Defects</h1>
          <p className="max-w-prose text-ink-600 dark:text-ink-300">
            What was found on {data.vessel.name} that no routine planned: reported, planned by the chief engineer, repaired through its work order, and closed
            with its cause and the action against a repeat. Values out of limits raise one too.
          </p>
        </div>
        {data.canReport && (
          <button type="button" className="btn-primary" onClick={() => setPanel("report")}>
            Report a defect
          </button>
        )}
      </div>
      {notice && (
        <p role="status" className="rounded-md bg-tide-50 px-3 py-2 font-medium text-tide-900 dark:bg-tide-900/40 dark:text-tide-100">
          {notice}
        </p>
      )}
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" className="accent-tide-600" checked={state === "all"} onChange={(e) => setState(e.target.checked ? "all" : "open")} />
        Show closed defects too
      </label>
      {data.defects.length === 0 ? (
        <p className="panel p-4 text-ink-600 dark:text-ink-300">{state === "open" ? "No defect is open." : "No defect has been reported."}</p>
      ) : (
        <div className="overflow-x-auto panel">
          <table className="w-full text-sm">
            <caption className="sr-only">Defect reports of {data.vessel.name}</caption>
            <thead className="text-left text-xs text-ink-500 uppercase">
              <tr className="border-b border-ink-200 dark:border-ink-800">
                <th className="px-3 py-2 font-semibold">Defect</th>
                <th className="px-3 py-2 font-semibold">What was found</th>
                <th className="px-3 py-2 font-semibold">State</th>
                <th className="px-3 py-2 font-semibold">Target</th>
                <th className="px-3 py-2 text-right font-semibold">Age</th>
                {data.canPlan && (
                  <th className="px-3 py-2">
                    <span className="sr-only">Actions</span>
                  </th>
                )}
              </tr>
            </thead>
            <tbody>
              {data.defects.map((d) => {
                const flags = defectFlags(d);
                return (
                  <tr key={d.id} className="border-t border-ink-100 align-top dark:border-ink-800" data-defect={d.number}>
                    <td className="px-3 py-2 whitespace-nowrap">
                      <span className="font-mono">{d.number}</span>
                      <Link href={`/vessels/${vesselId}/work-orders/${d.workOrder.id}`} className={`block text-xs ${LINK}`}>
                        {d.workOrder.number}
                      </Link>
                    </td>
                    <td className="px-3 py-2">
                      <span className="font-medium">{d.title}</span>
                      <span className="block text-xs text-ink-500">
                        {d.component.code} {d.component.name} · found {formatShipTime(new Date(d.foundAt), tz)}
                        {d.reportedBy ? ` by ${d.reportedBy}` : ""}
                      </span>
                      {flags.length > 0 && <span className="block text-xs font-semibold text-alarm-700 dark:text-alarm-300">{flags.join(" · ")}</span>}
                    </td>
                    <td className="px-3 py-2">{DEFECT_STATE_WORDS[d.state]}</td>
                    <td className="px-3 py-2 whitespace-nowrap tabular-nums">{d.targetDay ?? "—"}</td>
                    <td className="px-3 py-2 text-right tabular-nums">{d.ageDays} d</td>
                    {data.canPlan && (
                      <td className="px-3 py-2">
                        {(d.state === "reported" || d.state === "planned") && (
                          <button type="button" className="btn-quiet" onClick={() => setPanel(d)}>
                            {d.state === "reported" ? "Plan" : "Re-plan"}
                            <span className="sr-only"> {d.number}</span>
                          </button>
                        )}
                      </td>
                    )}
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
      {panel === "report" && (
        <SidePanel title="Report a defect" onClose={() => setPanel(null)} wide>
          <ReportForm
            list={data}
            onCancel={() => setPanel(null)}
            onDone={(saved) => {
              setPanel(null);
              setNotice(
                <>
                  {saved.number} reported as {saved.workOrder.number}.{" "}
                  <Link href={`/vessels/${vesselId}/work-orders/${saved.workOrder.id}`} className="underline underline-offset-2">
                    Add photos on its work order
                  </Link>
                </>,
              );
            }}
          />
        </SidePanel>
      )}
      {panel && panel !== "report" && (
        <SidePanel title={`Plan ${panel.number}`} onClose={() => setPanel(null)} wide>
          <PlanForm
            vesselId={vesselId}
            defect={panel}
            today={shipDay(new Date(), tz)}
            onCancel={() => setPanel(null)}
            onDone={(message) => {
              setPanel(null);
              setNotice(message);
            }}
          />
        </SidePanel>
      )}
    </div>
  );
}
