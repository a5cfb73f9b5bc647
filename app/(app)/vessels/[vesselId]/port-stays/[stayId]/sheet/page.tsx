import type { Metadata } from "next";
import Link from "next/link";
import { loadRankNames } from "@/server/admin/rank-names";
import { type RankWords, rankWords } from "@/server/routines/rank-names";
import { notFound } from "next/navigation";
import { requirePageParams, requirePageVessel } from "@/server/auth/access";
import { PortStayParams } from "@/server/http/params";
import { formatHours } from "@/server/format/hours";
import { AppError } from "@/server/http/problem";
import { loadPackageSheet, type SheetJob } from "@/server/port-stays/sheet";
import { Cautions } from "../../../work-orders/[workOrderId]/_components/cautions";
import { dayLabel, ENGINE_STOP_CAUTION, engineStopWords, personLabel, stayPeriod } from "../../_components/stay-words";
import { PrintButton } from "@/app/_components/print-button";

export const metadata: Metadata = { title: "Work package sheet" };

/** The package as paper for the engine room: per day, each job with its checklist, parts and cautions. */
export default async function PackageSheetPage({ params }: { params: Promise<{ vesselId: string; stayId: string }> }) {
  const { vesselId, ...ids } = await params;
  const { access, vessel } = await requirePageVessel(vesselId);
  const { stayId } = requirePageParams(PortStayParams, ids);
  const sheet = await loadPackageSheet(access, vessel, stayId).catch((error: unknown) => {
    if (error instanceof AppError && error.code === "not-found") notFound();
    throw error;
  });
  const { stay } = sheet;
  const ranks = rankWords(await loadRankNames(access.company.id));
  const jobs = sheet.days.reduce((n, d) => n + d.jobs.length, 0);
  return (
    <main className="grid gap-4 print:block print:text-[11pt] print:text-black">
      <p className="no-print flex flex-wrap items-center gap-4 text-sm">
        <Link
          href={`/vessels/${vessel.id}/port-stays/${stay.id}`}
          className="text-tide-700 underline-offset-2 hover:underline dark:text-tide-300"
        >
          ← {stay.port}
        </Link>
        <PrintButton />
      </p>
      <header className="border-b-2 border-ink-900 pb-2 dark:border-ink-100 print:border-black">
        <p className="font-mono text-xs">
          {vessel.name} · {vessel.code} · IMO {vessel.imoNumber}
        </p>
        <h1 className="text-xl font-bold">Work package: {stay.port}</h1>
        <p className="tabular-nums">
          {stayPeriod(stay.arrivesAt, stay.departsAt, vessel.timeZone)} ship’s time ({vessel.timeZone}) ·{" "}
          main engine {engineStopWords(stay.engineStop)} · working day {stay.workdayFrom}–{stay.workdayTo} · {jobs} job{jobs === 1 ? "" : "s"}
          {!stay.packageAcceptedAt && " · not accepted yet"}
        </p>
      </header>
      <p className="rounded border-2 border-brass-500 p-3 font-medium print:my-3 print:border-black">
        ⚠ Keelson plans and records; it does not replace the maker’s instruction manual, the permit to work or the
        ship’s safety management system. The maker’s figures and procedures, local regulations, flag-state and class
        requirements prevail. Isolate and lock out before opening any machinery.
      </p>
      <p className="text-sm font-medium">⚠ {ENGINE_STOP_CAUTION}</p>
      {sheet.days.map(({ day, jobs }) => (
        <section key={day} aria-labelledby={`sheet-${day}`} className="grid gap-3 print:mt-4">
          <h2 id={`sheet-${day}`} className="border-b border-ink-300 pb-1 text-lg font-bold print:border-black">
            {dayLabel(day)}
          </h2>
          {jobs.length === 0 ? (
            <p className="text-ink-600 dark:text-ink-300 print:text-black">No work planned on this day.</p>
          ) : (
            jobs.map((job) => <SheetJobCard key={job.workOrderId} job={job} ranks={ranks} />)
          )}
        </section>
      ))}
    </main>
  );
}

function SheetJobCard({ job, ranks }: { job: SheetJob; ranks: RankWords }) {
  return (
    <article className="grid gap-3 panel p-4 print:mb-4 print:break-inside-avoid print:rounded-none print:border-black print:shadow-none">
      <header className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="text-base font-bold">
          <span className="font-mono">{job.number}</span> {job.title}
        </h3>
        <p className="text-sm tabular-nums">
          {formatHours(job.manHours)} man-hours
          {job.needsEngineStop && " · engine stopped"}
          {job.critical && " · ⚠ critical"}
          {job.classRelated && " · ◆ class-related"}
        </p>
      </header>
      <p className="text-sm">
        <span className="font-mono">{job.componentCode}</span> {job.componentName}
      </p>
      <p className="text-sm tabular-nums">
        <span className="font-semibold">When:</span>{" "}
        {job.segments.map((s) => `${dayLabel(s.from.slice(0, 10))} ${s.from.slice(11, 16)}–${s.to.slice(11, 16)}`).join(" · ")}
        <br />
        <span className="font-semibold">Team:</span> {job.team.length ? `${ranks.team(job.team)}, ${formatHours(job.elapsedHours)}` : "not set"}
        <br />
        <span className="font-semibold">Who:</span> {job.people.map((p) => personLabel(p, ranks)).join(", ") || "not named"}
      </p>
      <p className="text-sm text-ink-600 dark:text-ink-300 print:text-black">{job.reason}</p>
      <div className="grid gap-4 sm:grid-cols-2 print:grid-cols-2">
        <div>
          <h4 className="text-sm font-semibold">Checklist</h4>
          {job.checklist.length ? (
            <ol className="mt-1 grid gap-1">
              {job.checklist.map((step, i) => (
                <li key={i} className="flex items-start gap-2">
                  <span
                    aria-hidden="true"
                    className="mt-0.5 inline-block size-4 shrink-0 border-2 border-ink-700 dark:border-ink-300 print:border-black"
                  />
                  <span>
                    {i + 1}. {step}
                  </span>
                </li>
              ))}
            </ol>
          ) : (
            <p className="text-sm">No checklist on the routine: follow the maker’s manual.</p>
          )}
        </div>
        <div>
          <h4 className="text-sm font-semibold">Spare parts to have ready</h4>
          <p className="mt-1 text-sm whitespace-pre-line">{job.spareParts || "None listed."}</p>
          <p className="mt-3 text-sm">
            Done by: ______________________ Date: __________ Man-hours: ______
          </p>
        </div>
      </div>
      <Cautions cautions={job.cautions} />
    </article>
  );
}
