"use client";

import { useState } from "react";
import { type DataColumn, DataTable, TableSkeleton } from "@/app/_components/data-table";
import { SidePanel } from "@/app/_components/forms/side-panel";
import { LoadProblem, Notice } from "@/app/_components/notice";
import type { AdminVessel } from "@/server/admin/contract";
import { ConfirmPanel } from "./confirm-panel";
import { RowButton } from "./row-button";
import { useAdminVessels, useRetireVessel, useSaveVessel } from "./use-admin";
import { VesselForm } from "./vessel-form";

type Open = { kind: "add" } | { kind: "edit" | "retire" | "return"; vessel: AdminVessel } | null;

const retiredOn = (iso: string) =>
  new Date(iso).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric" });

export function VesselAdmin() {
  const { data, error, isPending } = useAdminVessels();
  const retire = useRetireVessel();
  const save = useSaveVessel();
  const [open, setOpen] = useState<Open>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const done = (message: string) => {
    setOpen(null);
    setNotice(message);
  };

  if (isPending) return <TableSkeleton label="Loading the vessels" />;
  if (error) return <LoadProblem what="vessels" error={error} />;
  const inService = data.vessels.filter((v) => !v.retiredAt).length;
  const columns: DataColumn<AdminVessel>[] = [
    { id: "name", header: "Name", cellClassName: "font-semibold", cell: (v) => v.name },
    { id: "code", header: "Code", cellClassName: "font-mono", cell: (v) => v.code },
    { id: "imo", header: "IMO", cellClassName: "font-mono whitespace-nowrap", cell: (v) => `IMO ${v.imoNumber}` },
    { id: "zone", header: "Ship’s time zone", cell: (v) => v.timeZone },
    { id: "counters", header: "Counters", align: "right", cellClassName: "tabular-nums", cell: (v) => v.counters },
    {
      id: "assigned",
      header: "Assigned",
      align: "right",
      cellClassName: "tabular-nums",
      cell: (v) => v.assignedPeople,
    },
    {
      id: "status",
      header: "Status",
      cell: (v) =>
        v.retiredAt ? (
          <span>retired {retiredOn(v.retiredAt)}</span>
        ) : (
          <span className="font-medium text-go-700 dark:text-go-300">in service</span>
        ),
    },
    {
      id: "actions",
      header: "Actions",
      hideHeader: true,
      cell: (v) => (
        <div className="flex justify-end gap-1.5">
          <RowButton label="Edit" who={v.name} onClick={() => setOpen({ kind: "edit", vessel: v })} />
          <RowButton
            label={v.retiredAt ? "Return to service" : "Retire"}
            who={v.name}
            onClick={() => setOpen({ kind: v.retiredAt ? "return" : "retire", vessel: v })}
          />
        </div>
      ),
    },
  ];

  return (
    <section aria-labelledby="vessels-heading">
      <div className="mb-3 flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 id="vessels-heading" className="text-base font-semibold">
            Vessels
          </h2>
          <p className="text-ink-500 dark:text-ink-400">
            {inService} in service
            {data.vessels.length > inService ? `, ${data.vessels.length - inService} retired` : ""}
          </p>
        </div>
        <button type="button" className="btn-primary" onClick={() => setOpen({ kind: "add" })}>
          Add vessel
        </button>
      </div>
      <Notice message={notice} className="mb-3" />
      <DataTable
        columns={columns}
        rows={data.vessels}
        rowKey={(v) => v.id}
        labelledBy="vessels-heading"
        rowClassName={(v) => (v.retiredAt ? "text-ink-500 dark:text-ink-400" : "")}
        empty="No vessels yet. Add the first one; its IMO number is on the ship’s certificates."
      />

      {(open?.kind === "add" || open?.kind === "edit") && (
        <SidePanel
          title={open.kind === "add" ? "Add a vessel" : `Edit ${open.vessel.name}`}
          subtitle={
            open.kind === "edit"
              ? `${open.vessel.code} · IMO ${open.vessel.imoNumber}`
              : "Counters and components are added in the vessel’s machinery register."
          }
          onClose={() => setOpen(null)}
          closeOnBackdrop
        >
          <VesselForm vessel={open.kind === "edit" ? open.vessel : undefined} onDone={done} />
        </SidePanel>
      )}
      {open?.kind === "retire" && (
        <ConfirmPanel
          title={`Retire ${open.vessel.name}?`}
          subtitle={`${open.vessel.code} · IMO ${open.vessel.imoNumber}`}
          confirmLabel="Retire vessel"
          tone="alarm"
          onConfirm={async () => `${(await retire.mutateAsync(open.vessel.id)).name} is retired.`}
          onDone={done}
          onClose={() => setOpen(null)}
        >
          <p>It leaves the vessel lists and the vessel menu of everyone in the company.</p>
          <p>
            Its records stay: counters, readings, work orders and assignments are kept for audits, and its code stays
            reserved.
          </p>
          <p>You can return it to service later.</p>
        </ConfirmPanel>
      )}
      {open?.kind === "return" && (
        <ConfirmPanel
          title={`Return ${open.vessel.name} to service?`}
          confirmLabel="Return to service"
          tone="plain"
          onConfirm={async () =>
            `${(await save.mutateAsync({ id: open.vessel.id, values: { retired: false } })).name} is back in service.`
          }
          onDone={done}
          onClose={() => setOpen(null)}
        >
          <p>It comes back in the vessel lists, and the people still assigned to it can open it again.</p>
        </ConfirmPanel>
      )}
    </section>
  );
}
