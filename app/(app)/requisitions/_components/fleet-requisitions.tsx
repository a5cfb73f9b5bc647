"use client";
// The office's list to work from: every vessel's requisitions sent, ordered or still drafted (or
// all of them), oldest sent first, each with its parts; printable, and as CSV for purchasing.
import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useSearchParams } from "next/navigation";
import { useState } from "react";
import { fetchJson } from "@/app/_components/fetch-json";
import { LoadProblem } from "@/app/_components/notice";
import { queryKeys } from "@/app/_components/query-keys";
import { formatShipTime } from "@/server/format/hours";
import { amountText, type RequisitionView } from "@/server/parts/contract";
import { StateBadge } from "../../vessels/[vesselId]/requisitions/_components/requisitions-view";

const DAY = 86_400_000;

export function FleetRequisitions() {
  const params = useSearchParams();
  const [state, setState] = useState<"open" | "all">("open");
  const [vessel, setVessel] = useState(params.get("vessel") ?? "");
  // The moment the page opened: how long each has waited, counted once.
  const [now] = useState(() => Date.now());
  const query = useQuery({
    queryKey: queryKeys.fleetRequisitions(state),
    queryFn: () => fetchJson<{ requisitions: RequisitionView[] }>(`/api/requisitions?state=${state}`),
  });
  if (query.error) return <LoadProblem what="requisitions" error={query.error} />;
  const all = query.data?.requisitions ?? [];
  const vessels = [...new Map(all.map((r) => [r.vessel.code, r.vessel.name])).entries()].sort((a, b) => a[1].localeCompare(b[1]));
  // What the office must act on first: sent and waiting longest, then ordered, then drafts.
  const rank = { sent: 0, ordered: 1, drafted: 2, delivered: 3, cancelled: 4 } as const;
  const rows = all
    .filter((r) => !vessel || r.vessel.code === vessel)
    .sort((a, b) => rank[a.state] - rank[b.state] || (a.sentAt ?? a.createdAt).localeCompare(b.sentAt ?? b.createdAt));

  return (
    <div className="grid gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-xl font-bold">Requisitions</h1>
          <p className="max-w-prose text-ink-600 dark:text-ink-300">
            Parts the vessels ask for, for delivery at a port stay: sent ones first, longest waiting at the top. Open a requisition on its vessel’s page to mark it
            ordered.
          </p>
        </div>
        <div className="no-print flex flex-wrap gap-2">
          <button type="button" className="btn-quiet" onClick={() => window.print()}>
            Print
          </button>
          <a className="btn-quiet" href={`/api/requisitions/export?state=${state}`} download>
            Download CSV
          </a>
        </div>
      </div>
      <div className="no-print flex flex-wrap items-center gap-4 text-sm">
        <label className="flex items-center gap-2">
          Vessel
          <select className="field w-auto" value={vessel} onChange={(e) => setVessel(e.target.value)}>
            <option value="">All vessels</option>
            {vessels.map(([code, name]) => (
              <option key={code} value={code}>
                {name}
              </option>
            ))}
          </select>
        </label>
        <label className="flex items-center gap-2">
          <input type="checkbox" className="accent-tide-600" checked={state === "all"} onChange={(e) => setState(e.target.checked ? "all" : "open")} />
          Include delivered and cancelled
        </label>
      </div>
      {!query.data ? (
        <div className="h-48 animate-pulse panel" aria-busy="true" aria-label="Loading the requisitions" />
      ) : rows.length === 0 ? (
        <p className="panel p-4 text-ink-600 dark:text-ink-300">{state === "open" ? "No requisition is open." : "No requisition yet."}</p>
      ) : (
        <div className="overflow-x-auto panel">
          <table className="w-full text-sm">
            <caption className="sr-only">Requisitions of the fleet</caption>
            <thead className="text-left text-xs text-ink-500 uppercase">
              <tr className="border-b border-ink-200 dark:border-ink-800">
                <th className="px-3 py-2 font-semibold">Vessel</th>
                <th className="px-3 py-2 font-semibold">Requisition</th>
                <th className="px-3 py-2 font-semibold">Deliver at</th>
                <th className="px-3 py-2 font-semibold">Parts</th>
                <th className="px-3 py-2 text-right font-semibold">Waiting</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((r) => {
                const since = r.sentAt ?? r.createdAt;
                return (
                  <tr key={r.id} className="border-t border-ink-100 align-top dark:border-ink-800">
                    <td className="px-3 py-2">{r.vessel.name}</td>
                    <td className="px-3 py-2">
                      <Link href={`/vessels/${r.vessel.id}/requisitions?show=${r.number}`} className="font-mono text-tide-700 underline-offset-2 hover:underline dark:text-tide-300">
                        {r.number}
                      </Link>
                      <span className="mt-1 block">
                        <StateBadge state={r.state} />
                      </span>
                      {r.orderRef && <span className="block text-xs text-ink-500">order {r.orderRef}</span>}
                    </td>
                    <td className="px-3 py-2">{r.portStay ? `${r.portStay.port}, arriving ${formatShipTime(new Date(r.portStay.arrivesAt), r.vessel.timeZone)} ship’s time` : "—"}</td>
                    <td className="px-3 py-2">
                      <ul>
                        {r.lines.map((l) => (
                          <li key={l.id}>
                            <span className="tabular-nums">{amountText(l.quantity, l.unit)}</span> <span className="font-mono">{l.number}</span> {l.description}
                            {l.received > 0 && <span className="text-ink-500"> ({l.received} received)</span>}
                          </li>
                        ))}
                      </ul>
                    </td>
                    <td className="px-3 py-2 text-right whitespace-nowrap tabular-nums">
                      {r.state === "delivered" || r.state === "cancelled" ? "—" : `${Math.max(0, Math.floor((now - new Date(since).getTime()) / DAY))} d`}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}
