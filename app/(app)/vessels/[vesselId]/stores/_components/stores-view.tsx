"use client";
// What is on board, part by part: the quantity (the sum of its movements), where it is kept, and
// which critical spares and parts with a minimum are under it. Parts are received, counted and
// moved from here; each is a movement of its own.
import { useMemo, useState } from "react";
import { type DataColumn, DataTable, TableSkeleton } from "@/app/_components/data-table";
import { SidePanel } from "@/app/_components/forms/side-panel";
import { SearchField } from "@/app/_components/search-field";
import { LoadProblem, Notice } from "@/app/_components/notice";
import { amountText, type StockLine } from "@/server/parts/contract";
import { LocationForm } from "./location-form";
import { type MoveKind, MovementForm } from "./movement-form";
import { useStores } from "./use-stores";

const TITLE: Record<MoveKind, string> = { received: "Receive parts", counted: "Count a part", moved: "Move parts" };

export function StoresView({ vesselId }: { vesselId: string }) {
  const { data, error, isPending } = useStores(vesselId);
  const [panel, setPanel] = useState<{ kind: MoveKind; partId?: string } | "location" | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const [onlyLow, setOnlyLow] = useState(false);
  const [filter, setFilter] = useState("");
  const lines = useMemo(() => {
    const needle = filter.trim().toLowerCase();
    return (data?.lines ?? []).filter(
      (l) => (!onlyLow || l.low) && (!needle || `${l.part.number} ${l.part.description} ${l.part.makerRef}`.toLowerCase().includes(needle)),
    );
  }, [data, onlyLow, filter]);

  if (isPending) return <TableSkeleton label="Loading the stores" rows={6} />;
  if (error) return <LoadProblem what="stores" error={error} />;
  const low = data.lines.filter((l) => l.low).length;
  const done = (message: string) => {
    setPanel(null);
    setNotice(message);
  };

  const columns: DataColumn<StockLine>[] = [
    { id: "number", header: "Part number", cellClassName: "font-mono whitespace-nowrap", cell: (l) => l.part.number },
    {
      id: "part",
      header: "Part",
      cell: (l) => (
        <div>
          <span>{l.part.description}</span>
          {l.part.critical && <span className="ml-2 rounded border border-brass-400 px-1 text-xs font-semibold text-brass-700 dark:text-brass-300">critical spare</span>}
          {l.part.makerRef && <span className="block text-xs text-ink-500 dark:text-ink-400">maker’s ref. {l.part.makerRef}</span>}
        </div>
      ),
    },
    {
      id: "on-board",
      header: "On board",
      align: "right",
      cellClassName: "tabular-nums whitespace-nowrap",
      cell: (l) => (
        <span className={l.low ? "font-semibold text-alarm-700 dark:text-alarm-300" : ""}>
          {amountText(l.onBoard, l.part.unit)}
          {l.low && <span className="block text-xs font-semibold">under the minimum of {l.part.minimumOnBoard}</span>}
        </span>
      ),
    },
    { id: "minimum", header: "Minimum", align: "right", className: "hidden md:table-cell", cellClassName: "tabular-nums", cell: (l) => (l.part.minimumOnBoard > 0 ? l.part.minimumOnBoard : "—") },
    {
      id: "where",
      header: "Where",
      cell: (l) =>
        l.byLocation.length ? (
          <ul className="text-sm">
            {l.byLocation.map((b) => (
              <li key={b.locationId}>
                {b.place}: <span className="tabular-nums">{b.quantity}</span>
              </li>
            ))}
          </ul>
        ) : (
          <span className="text-ink-500">none on board</span>
        ),
    },
    ...(data.canWrite
      ? [
          {
            id: "actions",
            header: "Actions",
            hideHeader: true,
            cell: (l: StockLine) => (
              <div className="flex gap-1">
                {(["received", "counted", "moved"] as const).map((kind) => (
                  <button
                    key={kind}
                    type="button"
                    className="rounded px-1.5 py-0.5 text-xs font-semibold text-tide-700 hover:bg-tide-50 dark:text-tide-300 dark:hover:bg-tide-900/40"
                    aria-label={`${TITLE[kind].split(" ")[0]} ${l.part.number}`}
                    onClick={() => setPanel({ kind, partId: l.part.id })}
                  >
                    {TITLE[kind].split(" ")[0]}
                  </button>
                ))}
              </div>
            ),
          },
        ]
      : []),
  ];

  return (
    <div className="grid gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-xl font-bold">Stores on board</h1>
          <p className="max-w-prose text-ink-600 dark:text-ink-300">
            What {data.vessel.name} holds of each part, and where. Every quantity is the sum of what was received, used,
            counted and moved; nothing is overwritten.{" "}
            {low > 0 ? `${low} part${low === 1 ? " is" : "s are"} under the minimum the company set.` : "No part is under its minimum."}
          </p>
        </div>
        {data.canWrite && (
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn-primary" onClick={() => setPanel({ kind: "received" })} disabled={!data.locations.length}>
              Receive parts
            </button>
            <button type="button" className="btn-quiet" onClick={() => setPanel({ kind: "counted" })} disabled={!data.locations.length}>
              Count
            </button>
            <button type="button" className="btn-quiet" onClick={() => setPanel("location")}>
              Add location
            </button>
          </div>
        )}
      </div>
      <Notice message={notice} />
      {data.canWrite && !data.locations.length && (
        <p className="panel p-4">Add the first place parts are kept on board (a store, with its racks and bins) to receive parts into it.</p>
      )}
      <section aria-labelledby="stock-heading" className="panel">
        <div className="flex flex-wrap items-center gap-3 border-b border-ink-200 px-4 py-3 dark:border-ink-800">
          <h2 id="stock-heading" className="mr-auto font-semibold">
            Parts <span className="font-normal text-ink-500">({lines.length})</span>
          </h2>
          <SearchField label="Find a part by number, description or maker’s reference" placeholder="Find a part…" value={filter} onChange={setFilter} />
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" className="accent-tide-600" checked={onlyLow} onChange={(e) => setOnlyLow(e.target.checked)} />
            Only under the minimum
          </label>
        </div>
        <DataTable
          columns={columns}
          rows={lines}
          rowKey={(l) => l.part.id}
          labelledBy="stock-heading"
          alignTop
          empty={
            data.lines.length
              ? "No part matches."
              : "No part is on board yet, and the catalogue names no critical spare. Receive parts, or add them to the company’s catalogue."
          }
        />
      </section>
      {panel === "location" && (
        <SidePanel title="Add a location on board" onClose={() => setPanel(null)}>
          <LocationForm vesselId={vesselId} onDone={done} onCancel={() => setPanel(null)} />
        </SidePanel>
      )}
      {panel && panel !== "location" && (
        <SidePanel title={TITLE[panel.kind]} onClose={() => setPanel(null)}>
          <MovementForm vesselId={vesselId} kind={panel.kind} partId={panel.partId} locations={data.locations} lines={data.lines} onDone={done} onCancel={() => setPanel(null)} />
        </SidePanel>
      )}
    </div>
  );
}
