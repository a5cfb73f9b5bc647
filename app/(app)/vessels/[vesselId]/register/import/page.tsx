import type { Metadata } from "next";
import Link from "next/link";
import { requirePageVessel } from "@/server/auth/access";
import { can } from "@/server/auth/roles";
import { IMPORT_KINDS, LAYOUT } from "@/server/import/layout";
import { listAccessibleVessels } from "@/server/vessels/queries";
import { ImportView } from "./_components/import-view";

export const metadata: Metadata = { title: "Import the plan · Machinery register" };

export default async function ImportPage({ params }: { params: Promise<{ vesselId: string }> }) {
  const { vesselId } = await params;
  const { access, vessel } = await requirePageVessel(vesselId);
  const template = (kind: string, example: boolean) =>
    `/api/vessels/${vessel.id}/import/template?kind=${kind}${example ? "&example=yes" : ""}`;
  return (
    <main className="grid gap-4">
      <p className="text-sm">
        <Link href={`/vessels/${vessel.id}/register`} className="text-tide-700 underline underline-offset-2 dark:text-tide-300">
          ← Machinery register
        </Link>
      </p>
      <h1 className="text-xl font-bold">Import {vessel.name}’s plan from files</h1>
      <p className="max-w-prose text-ink-700 dark:text-ink-200">
        Bring in the machinery register, the counters, the routines, when each was last done and the readings history
        from spreadsheets: one CSV file per kind (comma or semicolon separated, UTF-8; loose or in a zip), or one Excel
        workbook with a worksheet per kind. Keelson
        checks every row first and shows what would be created, changed and left alone; nothing is written until you
        apply, and then all or nothing. Importing the same files again changes nothing.
      </p>
      {can(access.role, "register:edit") ? (
        <ImportView
          vesselId={vessel.id}
          sisters={(await listAccessibleVessels(access)).filter((v) => v.id !== vessel.id).map(({ id, name }) => ({ id, name }))}
        />
      ) : (
        <p className="panel p-4">Only the vessel’s chief engineer and the company administrator import a plan.</p>
      )}
      <section aria-labelledby="export-heading" className="panel grid gap-2 p-4">
        <h2 id="export-heading" className="font-semibold">
          Take the plan out
        </h2>
        <p className="max-w-prose text-sm text-ink-700 dark:text-ink-200">
          {vessel.name}’s register, counters, routines, last-done days and readings in the same layout: imported into
          an empty vessel, they give the same plan. A routine made in Keelson gets its component’s code and a number as its code.
        </p>
        <p className="flex flex-wrap gap-4 text-sm">
          <a className="text-tide-700 underline underline-offset-2 dark:text-tide-300" href={`/api/vessels/${vessel.id}/export`} download>
            The whole plan as a workbook (.xlsx)
          </a>
          <a className="text-tide-700 underline underline-offset-2 dark:text-tide-300" href={`/api/vessels/${vessel.id}/export?format=zip`} download>
            The whole plan as CSV files (.zip)
          </a>
          <a className="text-tide-700 underline underline-offset-2 dark:text-tide-300" href={`/api/vessels/${vessel.id}/export/history`} download>
            Maintenance history (.csv)
          </a>
          {IMPORT_KINDS.map((kind) => (
            <a key={kind} className="text-tide-700 underline underline-offset-2 dark:text-tide-300" href={`/api/vessels/${vessel.id}/export?kind=${kind}`} download>
              {kind}.csv
            </a>
          ))}
        </p>
      </section>
      <section aria-labelledby="layout-heading" className="panel grid gap-3 p-4">
        <h2 id="layout-heading" className="font-semibold">
          The files’ layout
        </h2>
        <p className="max-w-prose text-sm text-ink-700 dark:text-ink-200">
          The first row of each file names its columns; a file is known by its name (routines.csv) or its columns.
          Download an empty template or a filled example of each.
        </p>
        {IMPORT_KINDS.map((kind) => (
          <details key={kind} className="rounded-md border border-ink-200 p-3 dark:border-ink-800">
            <summary className="cursor-pointer font-medium">
              {kind} — {LAYOUT[kind].title.split(": ")[1] ?? LAYOUT[kind].title}
            </summary>
            <p className="mt-2 flex flex-wrap gap-4 text-sm">
              <a className="text-tide-700 underline underline-offset-2 dark:text-tide-300" href={template(kind, false)} download>
                Empty {kind}.csv
              </a>
              <a className="text-tide-700 underline underline-offset-2 dark:text-tide-300" href={template(kind, true)} download>
                Example {kind}.csv
              </a>
            </p>
            <table className="mt-2 w-full text-left text-sm">
              <thead>
                <tr className="text-ink-600 dark:text-ink-300">
                  <th scope="col" className="py-1 pr-3 font-medium">Column</th>
                  <th scope="col" className="py-1 pr-3 font-medium">What it holds</th>
                  <th scope="col" className="py-1 font-medium">Example</th>
                </tr>
              </thead>
              <tbody>
                {LAYOUT[kind].columns.map((c) => (
                  <tr key={c.name} className="border-t border-ink-100 align-top dark:border-ink-800">
                    <th scope="row" className="py-1 pr-3 font-mono font-normal whitespace-nowrap">
                      {c.name}
                      {c.required && <span className="text-alarm-700 dark:text-alarm-300"> (required)</span>}
                    </th>
                    <td className="py-1 pr-3">{c.meaning}</td>
                    <td className="py-1 font-mono text-xs">{c.example}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </details>
        ))}
      </section>
    </main>
  );
}
