import type { Metadata } from "next";
import Link from "next/link";
import { DataTable } from "@/app/_components/data-table";
import { requireCompanyAdmin } from "@/server/admin/page-access";
import { listCompanyVessels } from "@/server/admin/queries";
import { type AuditItem, AuditSearchQuery } from "@/server/audit/contract";
import { AUDIT_KIND_KEYS, AUDIT_KINDS } from "@/server/audit/kinds";
import { searchTrail, trailPeople } from "@/server/audit/queries";
import { formatShipTime } from "@/server/format/hours";
import { AuditChanges } from "./audit-changes";

export const metadata: Metadata = { title: "Audit trail · Company" };

type SearchParams = Promise<Record<string, string | string[] | undefined>>;

const FIELDS = ["person", "vessel", "kind", "from", "until"] as const;

export default async function AuditTrailPage({ searchParams }: { searchParams: SearchParams }) {
  const access = await requireCompanyAdmin();
  const raw = await searchParams;
  const given = Object.fromEntries(
    [...FIELDS, "before"].map((k) => [k, typeof raw[k] === "string" ? raw[k] : undefined]),
  ) as Record<string, string | undefined>;
  const parsed = AuditSearchQuery.safeParse(given);
  const [people, vessels] = await Promise.all([trailPeople(access), listCompanyVessels(access)]);
  const page = parsed.success ? await searchTrail(access, parsed.data) : null;
  const problems = parsed.success ? [] : parsed.error.issues.map((i) => i.message);

  const filters = new URLSearchParams(
    FIELDS.flatMap((k) => (given[k] ? [[k, given[k]!] as [string, string]] : [])),
  ).toString();
  const next = page?.nextBefore ? `?${filters ? `${filters}&` : ""}before=${page.nextBefore}` : null;

  return (
    <main className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 id="audit-heading" className="text-xl font-bold">
            Audit trail
          </h1>
          <p className="max-w-3xl text-sm text-ink-600 dark:text-ink-300">
            Every change to the company’s records — who, when, which record, the values before and after, and the reason
            where one was asked. Entries are written by the database in the same transaction as the change and cannot be
            edited or deleted. Times are UTC.
          </p>
        </div>
        <div className="no-print flex gap-2">
          <a className="btn" href={`/api/admin/audit/export${filters ? `?${filters}` : ""}`} download>
            Download CSV
          </a>
        </div>
      </div>

      <form
        method="get"
        className="no-print grid gap-3 panel p-4 sm:grid-cols-3 lg:grid-cols-6"
        aria-label="Search the trail"
      >
        <Choice
          id="audit-person"
          name="person"
          label="Person"
          value={given.person}
          options={[
            { value: "", label: "Anyone" },
            { value: "system", label: "Keelson itself" },
            ...people.map((p) => ({ value: p.id, label: p.name })),
          ]}
        />
        <Choice
          id="audit-vessel"
          name="vessel"
          label="Vessel"
          value={given.vessel}
          options={[{ value: "", label: "Any vessel" }, ...vessels.map((v) => ({ value: v.id, label: v.name }))]}
        />
        <Choice
          id="audit-kind"
          name="kind"
          label="Kind of record"
          value={given.kind}
          options={[
            { value: "", label: "Any kind" },
            ...AUDIT_KIND_KEYS.map((k) => ({ value: k, label: AUDIT_KINDS[k].label })),
          ]}
        />
        <div>
          <label htmlFor="audit-from" className="label">
            From (UTC day)
          </label>
          <input id="audit-from" name="from" type="date" defaultValue={given.from ?? ""} className="field" />
        </div>
        <div>
          <label htmlFor="audit-until" className="label">
            Until (UTC day)
          </label>
          <input id="audit-until" name="until" type="date" defaultValue={given.until ?? ""} className="field" />
        </div>
        <div className="flex items-end gap-2">
          <button type="submit" className="btn-primary">
            Search
          </button>
          <Link href="/admin/audit" className="btn-quiet">
            Clear
          </Link>
        </div>
      </form>

      {problems.length > 0 && (
        <div role="alert" className="panel border-alarm-500 p-3 text-sm text-alarm-700 dark:text-alarm-300">
          {problems.map((p) => (
            <p key={p}>{p}</p>
          ))}
        </div>
      )}

      {page && (
        <>
          <DataTable<AuditItem>
            labelledBy="audit-heading"
            rows={page.items}
            rowKey={(i) => String(i.id)}
            density="compact"
            alignTop
            empty={given.before ? "No older entries." : "No change matches this search."}
            columns={[
              {
                id: "at",
                header: "When (UTC)",
                cellClassName: "whitespace-nowrap tabular-nums",
                cell: (i) => formatShipTime(new Date(i.at), "UTC"),
              },
              {
                id: "by",
                header: "By",
                cell: (i) =>
                  i.byPerson ? i.by : <span className="text-ink-500 italic dark:text-ink-400">{i.by}</span>,
              },
              { id: "vessel", header: "Vessel", className: "hidden md:table-cell", cell: (i) => i.vessel ?? "—" },
              {
                id: "record",
                header: "Record",
                cell: (i) => (
                  <>
                    <span className="font-medium">{i.record}</span> <span className="text-ink-500">{i.action}</span>
                    <span className="block text-xs text-ink-500 dark:text-ink-400">{i.kind}</span>
                  </>
                ),
              },
              { id: "changes", header: "Changes", cell: (i) => <AuditChanges item={i} /> },
              { id: "entry", header: "Entry", align: "right", className: "hidden lg:table-cell", cell: (i) => i.id },
            ]}
          />
          {next && (
            <p className="no-print">
              <Link href={next} className="btn">
                Older entries
              </Link>
            </p>
          )}
        </>
      )}
    </main>
  );
}

/** A labelled list of the search form; its choice stays selected after the search. */
function Choice({
  id,
  name,
  label,
  value,
  options,
}: {
  id: string;
  name: string;
  label: string;
  value: string | undefined;
  options: { value: string; label: string }[];
}) {
  return (
    <div>
      <label htmlFor={id} className="label">
        {label}
      </label>
      <select id={id} name={name} defaultValue={value ?? ""} className="field">
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </div>
  );
}
