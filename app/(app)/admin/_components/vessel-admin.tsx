"use client";

import { useState } from "react";
import { SidePanel } from "@/app/_components/forms/side-panel";
import { LoadProblem, Notice } from "@/app/_components/notice";
import type { AdminVessel } from "@/server/admin/contract";
import { ConfirmPanel } from "./confirm-panel";
import { RowButton } from "./row-button";
import { TableSkeleton } from "./table-skeleton";
import { useAdminVessels, useRetireVessel, useSaveVessel } from "./use-admin";
import { VesselForm } from "./vessel-form";

type Open = { kind: "add" } | { kind: "edit" | "retire" | "return"; vessel: AdminVessel } | null;

const TH = "px-3 py-2 font-semibold";
const TD = "px-3 py-2";

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
      <div className="relative overflow-x-auto panel">
        <table className="w-full text-left">
          <thead className="text-xs tracking-wide text-ink-500 uppercase dark:text-ink-400">
            <tr className="border-b border-ink-200 dark:border-ink-800">
              <th scope="col" className={`${TH} pl-4`}>
                Name
              </th>
              <th scope="col" className={TH}>
                Code
              </th>
              <th scope="col" className={TH}>
                IMO
              </th>
              <th scope="col" className={TH}>
                Ship’s time zone
              </th>
              <th scope="col" className={`${TH} text-right`}>
                Counters
              </th>
              <th scope="col" className={`${TH} text-right`}>
                Assigned
              </th>
              <th scope="col" className={TH}>
                Status
              </th>
              <th scope="col" className={`${TH} pr-4`}>
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {data.vessels.length === 0 && (
              <tr>
                <td colSpan={8} className="px-4 py-6 text-ink-500">
                  No vessels yet. Add the first one; its IMO number is on the ship’s certificates.
                </td>
              </tr>
            )}
            {data.vessels.map((v) => (
              <tr
                key={v.id}
                className={`border-b border-ink-100 last:border-0 dark:border-ink-850 ${v.retiredAt ? "text-ink-500 dark:text-ink-400" : ""}`}
              >
                <th scope="row" className={`${TD} pl-4 font-semibold`}>
                  {v.name}
                </th>
                <td className={`${TD} font-mono`}>{v.code}</td>
                <td className={`${TD} font-mono whitespace-nowrap`}>IMO {v.imoNumber}</td>
                <td className={TD}>{v.timeZone}</td>
                <td className={`${TD} text-right tabular-nums`}>{v.counters}</td>
                <td className={`${TD} text-right tabular-nums`}>{v.assignedPeople}</td>
                <td className={TD}>
                  {v.retiredAt ? (
                    <span>
                      retired{" "}
                      {new Date(v.retiredAt).toLocaleDateString("en-GB", {
                        day: "numeric",
                        month: "short",
                        year: "numeric",
                      })}
                    </span>
                  ) : (
                    <span className="font-medium text-go-700 dark:text-go-300">in service</span>
                  )}
                </td>
                <td className={`${TD} pr-4`}>
                  <div className="flex justify-end gap-1.5">
                    <RowButton label="Edit" who={v.name} onClick={() => setOpen({ kind: "edit", vessel: v })} />
                    <RowButton
                      label={v.retiredAt ? "Return to service" : "Retire"}
                      who={v.name}
                      onClick={() => setOpen({ kind: v.retiredAt ? "return" : "retire", vessel: v })}
                    />
                  </div>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>

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
