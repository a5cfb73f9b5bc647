"use client";

import { useMemo, useState } from "react";
import { type DataColumn, DataTable, TableSkeleton } from "@/app/_components/data-table";
import { SidePanel } from "@/app/_components/forms/side-panel";
import { LoadProblem, Notice } from "@/app/_components/notice";
import { ageOf } from "@/app/_components/relative-age";
import { SearchField } from "@/app/_components/search-field";
import type { AdminPerson } from "@/server/admin/contract";
import { ROLE_LABEL, seesWholeFleet } from "@/server/auth/roles";
import { ConfirmPanel } from "./confirm-panel";
import { PasswordPanel } from "./password-panel";
import { PersonForm } from "./person-form";
import { RowButton } from "./row-button";
import { useAdminPeople, useAdminVessels, useUpdatePerson } from "./use-admin";

type Open = { kind: "add" } | { kind: "edit" | "password" | "disable" | "enable"; person: AdminPerson } | null;

export function PeopleAdmin() {
  const people = useAdminPeople();
  const vessels = useAdminVessels();
  const update = useUpdatePerson();
  const [open, setOpen] = useState<Open>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const [filter, setFilter] = useState("");
  const now = useMemo(() => new Date(), []);
  const done = (message: string) => {
    setOpen(null);
    setNotice(message);
  };

  if (people.isPending || vessels.isPending) return <TableSkeleton label="Loading the people" />;
  if (people.error) return <LoadProblem what="people" error={people.error} />;
  if (vessels.error) return <LoadProblem what="vessels" error={vessels.error} />;

  const needle = filter.trim().toLowerCase();
  const shown = people.data.people.filter((p) =>
    needle
      ? [p.name, p.email, p.rank ?? "", ROLE_LABEL[p.role], ...p.vessels.map((v) => v.code)].some((t) =>
          t.toLowerCase().includes(needle),
        )
      : true,
  );
  const disabledCount = people.data.people.filter((p) => p.disabled).length;
  const columns: DataColumn<AdminPerson>[] = [
    {
      id: "name",
      header: "Name and e-mail",
      cellClassName: "font-normal",
      cell: (p) => (
        <>
          <span className="font-semibold whitespace-nowrap">{p.name}</span>
          {p.isYou && (
            <span className="ml-1.5 rounded bg-tide-50 px-1.5 py-0.5 text-xs font-medium text-tide-700 dark:bg-tide-900 dark:text-tide-200">
              you
            </span>
          )}
          <span className="block text-xs text-ink-500 dark:text-ink-400">{p.email}</span>
        </>
      ),
    },
    {
      id: "role",
      header: "Role",
      cellClassName: "whitespace-nowrap",
      cell: (p) => (
        <>
          {ROLE_LABEL[p.role]}
          {/* On a tablet the rank sits under the role, to keep the actions in view. */}
          {p.rank && <span className="block text-xs text-ink-500 lg:hidden dark:text-ink-400">{p.rank}</span>}
        </>
      ),
    },
    {
      id: "rank",
      header: "Rank",
      className: "hidden lg:table-cell",
      cellClassName: "whitespace-nowrap",
      cell: (p) => p.rank ?? <span className="text-ink-500">—</span>,
    },
    {
      id: "vessels",
      header: "Vessels",
      cell: (p) =>
        seesWholeFleet(p.role) ? (
          <span className="whitespace-nowrap text-ink-500 dark:text-ink-400">whole fleet</span>
        ) : p.vessels.length ? (
          <span className="font-mono text-xs" title={p.vessels.map((v) => v.name).join(", ")}>
            {p.vessels.map((v) => v.code).join(" · ")}
          </span>
        ) : (
          <span className="font-medium text-brass-700 dark:text-brass-300">none</span>
        ),
    },
    {
      id: "status",
      header: "Status",
      cell: (p) =>
        p.disabled ? (
          <span className="font-semibold text-alarm-700 dark:text-alarm-300">disabled</span>
        ) : p.invitedAt ? (
          <span className="font-medium text-brass-700 dark:text-brass-300" title="No password chosen yet">
            invited
          </span>
        ) : (
          <span className="font-medium text-go-700 dark:text-go-300">active</span>
        ),
    },
    {
      id: "last-sign-in",
      header: "Last sign-in",
      className: "hidden lg:table-cell",
      cellClassName: "whitespace-nowrap text-ink-600 dark:text-ink-300",
      cell: (p) => (p.lastSignInAt ? ageOf(p.lastSignInAt, now) : "—"),
    },
    {
      id: "actions",
      header: "Actions",
      hideHeader: true,
      cell: (p) => (
        <div className="flex justify-end gap-1.5">
          <RowButton label="Edit" who={p.name} onClick={() => setOpen({ kind: "edit", person: p })} />
          <RowButton label="Password" who={p.name} onClick={() => setOpen({ kind: "password", person: p })} />
          <RowButton
            label={p.disabled ? "Enable" : "Disable"}
            who={p.name}
            onClick={() => setOpen({ kind: p.disabled ? "enable" : "disable", person: p })}
          />
        </div>
      ),
    },
  ];

  return (
    <section aria-labelledby="people-heading">
      <div className="mb-3 flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 id="people-heading" className="text-base font-semibold">
            People
          </h2>
          <p className="text-ink-500 dark:text-ink-400">
            {people.data.people.length - disabledCount} active{disabledCount ? `, ${disabledCount} disabled` : ""}
          </p>
        </div>
        <div className="flex items-end gap-2">
          <SearchField
            label="Filter people"
            placeholder="Filter by name, rank, vessel…"
            value={filter}
            onChange={setFilter}
          />
          <button type="button" className="btn-primary" onClick={() => setOpen({ kind: "add" })}>
            Add person
          </button>
        </div>
      </div>
      <Notice message={notice} className="mb-3" />
      <DataTable
        columns={columns}
        rows={shown}
        rowKey={(p) => p.id}
        labelledBy="people-heading"
        rowClassName={(p) => (p.disabled ? "text-ink-500 dark:text-ink-400" : "")}
        empty={`Nobody matches “${filter}”.`}
      />

      {(open?.kind === "add" || open?.kind === "edit") && (
        <SidePanel
          title={open.kind === "add" ? "Add a person" : `Edit ${open.person.name}`}
          subtitle={
            open.kind === "edit"
              ? open.person.email
              : "They sign in with their e-mail address and the initial password."
          }
          onClose={() => setOpen(null)}
          wide
          closeOnBackdrop
        >
          <PersonForm
            person={open.kind === "edit" ? open.person : undefined}
            vessels={vessels.data.vessels}
            onDone={done}
          />
        </SidePanel>
      )}
      {open?.kind === "password" && <PasswordPanel person={open.person} onDone={done} onClose={() => setOpen(null)} />}
      {open?.kind === "disable" && (
        <ConfirmPanel
          title={`Disable ${open.person.name}?`}
          subtitle={open.person.email}
          confirmLabel={open.person.isYou ? "Disable my account" : "Disable"}
          tone="alarm"
          onConfirm={async () =>
            `${(await update.mutateAsync({ id: open.person.id, changes: { disabled: true } })).name} is disabled.`
          }
          onDone={done}
          onClose={() => setOpen(null)}
        >
          <p>
            {open.person.isYou ? "You are" : "They are"} signed out at once on every device and cannot sign in until
            enabled again.
          </p>
          <p>Their readings and records stay, with their name on them.</p>
        </ConfirmPanel>
      )}
      {open?.kind === "enable" && (
        <ConfirmPanel
          title={`Enable ${open.person.name}?`}
          subtitle={open.person.email}
          confirmLabel="Enable"
          tone="plain"
          onConfirm={async () =>
            `${(await update.mutateAsync({ id: open.person.id, changes: { disabled: false } })).name} can sign in again.`
          }
          onDone={done}
          onClose={() => setOpen(null)}
        >
          <p>They can sign in again with their current password. If it may have been passed on, reset it too.</p>
        </ConfirmPanel>
      )}
    </section>
  );
}
