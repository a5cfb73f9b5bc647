"use client";

import { useMemo, useState } from "react";
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
import { TableSkeleton } from "./table-skeleton";
import { useAdminPeople, useAdminVessels, useUpdatePerson } from "./use-admin";

type Open = { kind: "add" } | { kind: "edit" | "password" | "disable" | "enable"; person: AdminPerson } | null;

const TH = "px-3 py-2 font-semibold";
const TD = "px-3 py-2";

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
      <div className="relative overflow-x-auto panel">
        <table className="w-full text-left">
          <thead className="text-xs tracking-wide text-ink-500 uppercase dark:text-ink-400">
            <tr className="border-b border-ink-200 dark:border-ink-800">
              <th scope="col" className={`${TH} pl-4`}>
                Name and e-mail
              </th>
              <th scope="col" className={TH}>
                Role
              </th>
              <th scope="col" className={`${TH} hidden lg:table-cell`}>
                Rank
              </th>
              <th scope="col" className={TH}>
                Vessels
              </th>
              <th scope="col" className={TH}>
                Status
              </th>
              <th scope="col" className={`${TH} hidden lg:table-cell`}>
                Last sign-in
              </th>
              <th scope="col" className={`${TH} pr-4`}>
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {shown.length === 0 && (
              <tr>
                <td colSpan={7} className="px-4 py-6 text-ink-500">
                  Nobody matches “{filter}”.
                </td>
              </tr>
            )}
            {shown.map((p) => (
              <tr
                key={p.id}
                className={`border-b border-ink-100 last:border-0 dark:border-ink-850 ${p.disabled ? "text-ink-500 dark:text-ink-400" : ""}`}
              >
                <th scope="row" className={`${TD} pl-4 font-normal`}>
                  <span className="font-semibold whitespace-nowrap">{p.name}</span>
                  {p.isYou && (
                    <span className="ml-1.5 rounded bg-tide-50 px-1.5 py-0.5 text-xs font-medium text-tide-700 dark:bg-tide-900 dark:text-tide-200">
                      you
                    </span>
                  )}
                  <span className="block text-xs text-ink-500 dark:text-ink-400">{p.email}</span>
                </th>
                <td className={`${TD} whitespace-nowrap`}>
                  {ROLE_LABEL[p.role]}
                  {/* On a tablet the rank sits under the role, to keep the actions in view. */}
                  {p.rank && <span className="block text-xs text-ink-500 lg:hidden dark:text-ink-400">{p.rank}</span>}
                </td>
                <td className={`${TD} hidden whitespace-nowrap lg:table-cell`}>
                  {p.rank ?? <span className="text-ink-400">—</span>}
                </td>
                <td className={TD}>
                  {seesWholeFleet(p.role) ? (
                    <span className="whitespace-nowrap text-ink-500 dark:text-ink-400">whole fleet</span>
                  ) : p.vessels.length ? (
                    <span className="font-mono text-xs" title={p.vessels.map((v) => v.name).join(", ")}>
                      {p.vessels.map((v) => v.code).join(" · ")}
                    </span>
                  ) : (
                    <span className="font-medium text-brass-700 dark:text-brass-300">none</span>
                  )}
                </td>
                <td className={TD}>
                  {p.disabled ? (
                    <span className="font-semibold text-alarm-700 dark:text-alarm-300">disabled</span>
                  ) : p.invitedAt ? (
                    <span className="font-medium text-brass-700 dark:text-brass-300" title="No password chosen yet">
                      invited
                    </span>
                  ) : (
                    <span className="font-medium text-go-700 dark:text-go-300">active</span>
                  )}
                </td>
                <td className={`${TD} hidden whitespace-nowrap text-ink-600 lg:table-cell dark:text-ink-300`}>
                  {p.lastSignInAt ? ageOf(p.lastSignInAt, now) : "—"}
                </td>
                <td className={`${TD} pr-4`}>
                  <div className="flex justify-end gap-1.5">
                    <RowButton label="Edit" who={p.name} onClick={() => setOpen({ kind: "edit", person: p })} />
                    <RowButton label="Password" who={p.name} onClick={() => setOpen({ kind: "password", person: p })} />
                    <RowButton
                      label={p.disabled ? "Enable" : "Disable"}
                      who={p.name}
                      onClick={() => setOpen({ kind: p.disabled ? "enable" : "disable", person: p })}
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
