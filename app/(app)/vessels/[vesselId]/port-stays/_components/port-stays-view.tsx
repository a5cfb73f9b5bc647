"use client";

import Link from "next/link";
import { useState } from "react";
import { type DataColumn, DataTable, TableSkeleton } from "@/app/_components/data-table";
import { SidePanel } from "@/app/_components/forms/side-panel";
import { LoadProblem, Notice } from "@/app/_components/notice";
import type { PortStayView } from "@/server/port-stays/contract";
import { StayForm } from "./stay-form";
import { engineStopWords, stayPeriod } from "./stay-words";
import { usePortStays } from "./use-port-stays";

type Props = { vesselId: string; timeZone: string };

export function PortStaysView({ vesselId, timeZone }: Props) {
  const { data, error, isPending } = usePortStays(vesselId);
  const [adding, setAdding] = useState(false);
  const [notice, setNotice] = useState<string | null>(null);

  if (isPending) return <TableSkeleton label="Loading the port stays" rows={4} />;
  if (error) return <LoadProblem what="port stays" error={error} />;

  return (
    <div className="grid gap-6">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-xl font-bold">Port stays</h1>
          <p className="text-ink-600 dark:text-ink-300">
            Port calls with the crew on board and the working day; plan each one’s work package. Times are ship’s time (
            {timeZone}).
          </p>
        </div>
        {data.may.plan && (
          <button type="button" className="btn-primary" onClick={() => setAdding(true)}>
            Add port stay
          </button>
        )}
      </div>
      <Notice message={notice} />
      <StayTable
        vesselId={vesselId}
        timeZone={timeZone}
        title="Upcoming"
        stays={data.upcoming}
        empty={
          data.may.plan
            ? "No port stay is planned. Add the next port call to plan its work package."
            : "No port stay is planned yet; the chief engineer adds them."
        }
      />
      <StayTable
        vesselId={vesselId}
        timeZone={timeZone}
        title="Past"
        stays={data.past}
        empty="No past port stays are recorded."
      />
      {adding && (
        <SidePanel
          title="Add a port stay"
          subtitle="The crew table starts from the latest stay."
          onClose={() => setAdding(false)}
          wide
        >
          <StayForm
            vesselId={vesselId}
            timeZone={timeZone}
            latest={data.latest}
            onDone={(message) => {
              setAdding(false);
              setNotice(message);
            }}
          />
        </SidePanel>
      )}
    </div>
  );
}

function StayTable({
  vesselId,
  timeZone,
  title,
  stays,
  empty,
}: {
  vesselId: string;
  timeZone: string;
  title: string;
  stays: PortStayView[];
  empty: string;
}) {
  const id = `stays-${title.toLowerCase()}`;
  const columns: DataColumn<PortStayView>[] = [
    {
      id: "port",
      header: "Port",
      cell: (s) => (
        <>
          <Link
            href={`/vessels/${vesselId}/port-stays/${s.id}`}
            className="font-semibold text-tide-700 underline-offset-2 hover:underline dark:text-tide-300"
          >
            {s.port}
          </Link>
          {s.remarks && <span className="block font-normal text-ink-500 dark:text-ink-400">{s.remarks}</span>}
        </>
      ),
    },
    {
      id: "period",
      header: "Arrival – departure",
      cellClassName: "whitespace-nowrap tabular-nums",
      cell: (s) => (
        <>
          {stayPeriod(s.arrivesAt, s.departsAt, timeZone)}
          <span className="block text-ink-500 dark:text-ink-400">
            {s.days.length} ship’s day{s.days.length === 1 ? "" : "s"}
          </span>
        </>
      ),
    },
    {
      id: "engine",
      header: "Main engine",
      cell: (s) => engineStopWords(s.engineStop),
    },
    {
      id: "package",
      header: "Work package",
      cell: (s) =>
        s.packageAcceptedAt ? (
          <span className="font-medium text-go-700 dark:text-go-300">
            ✓ accepted, {s.itemCount} job{s.itemCount === 1 ? "" : "s"}
          </span>
        ) : (
          <span className="text-ink-600 dark:text-ink-300">not planned yet</span>
        ),
    },
  ];
  return (
    <section aria-labelledby={id}>
      <h2 id={id} className="mb-2 text-base font-semibold">
        {title}
      </h2>
      {stays.length === 0 ? (
        <p className="panel p-4 text-ink-600 dark:text-ink-300">{empty}</p>
      ) : (
        <DataTable
          columns={columns}
          rows={stays}
          rowKey={(s) => s.id}
          labelledBy={id}
          alignTop
          className="text-sm"
          empty={empty}
        />
      )}
    </section>
  );
}
