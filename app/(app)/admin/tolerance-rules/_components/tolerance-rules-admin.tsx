"use client";

import { useState } from "react";
import { type DataColumn, DataTable, TableSkeleton } from "@/app/_components/data-table";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { SidePanel } from "@/app/_components/forms/side-panel";
import { LoadProblem, Notice } from "@/app/_components/notice";
import type { ToleranceKind } from "@/server/scheduling/tolerance";
import type { AdminToleranceRule } from "@/server/tolerance/contract";
import { ConfirmPanel } from "../../_components/confirm-panel";
import { RowButton } from "../../_components/row-button";
import { RecordTrail } from "@/app/_components/record-trail";
import { ToleranceRuleForm } from "./tolerance-rule-form";
import { matchesWords, spanWords } from "./tolerance-words";
import { useDeleteToleranceRule, useRestorePresets, useToleranceRules } from "./use-tolerance-rules";

type Open =
  | { kind: "add"; ruleKind: ToleranceKind }
  | { kind: "edit"; rule: AdminToleranceRule }
  | { kind: "delete"; rule: AdminToleranceRule }
  | null;

const KIND_HEADING: Record<ToleranceKind, string> = {
  calendar: "Calendar intervals",
  hours: "Running-hours intervals",
};

export function ToleranceRulesAdmin() {
  const { data, error, isPending } = useToleranceRules();
  const remove = useDeleteToleranceRule();
  const restore = useRestorePresets();
  const [open, setOpen] = useState<Open>(null);
  const [notice, setNotice] = useState<{ message: string; tone: "done" | "problem" } | null>(null);
  const done = (message: string) => {
    setOpen(null);
    setNotice({ message, tone: "done" });
  };

  async function restorePresets() {
    setNotice(null);
    try {
      const { restored } = await restore.mutateAsync();
      setNotice({
        tone: "done",
        message: restored.length
          ? `Restored ${restored.length === 1 ? "1 preset" : `${restored.length} presets`}: ${restored.join("; ")}.`
          : "Every preset is there already; nothing was added.",
      });
    } catch (e) {
      setNotice({ tone: "problem", message: problemSentence(e, "nothing was restored") });
    }
  }

  if (isPending) return <TableSkeleton label="Loading the tolerance rules" />;
  if (error) return <LoadProblem what="tolerance rules" error={error} />;

  return (
    <section aria-labelledby="rules-heading" className="grid gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div className="max-w-3xl">
          <h2 id="rules-heading" className="text-base font-semibold">
            Tolerance rules
          </h2>
          <p className="text-ink-500 dark:text-ink-400">
            Each routine takes the rule of its kind whose interval range holds its interval, the narrowest range first;
            a routine can also choose a rule by hand. Class and flag requirements and the maker’s figures prevail over
            any rule here: where they are tighter, choose a tighter rule on the routine.
          </p>
        </div>
        <div className="flex gap-2">
          <button type="button" className="btn-quiet" onClick={restorePresets} disabled={restore.isPending}>
            {restore.isPending ? "Restoring…" : "Restore the presets"}
          </button>
          <button type="button" className="btn-primary" onClick={() => setOpen({ kind: "add", ruleKind: "calendar" })}>
            Add rule
          </button>
        </div>
      </div>
      <Notice message={notice?.message ?? null} tone={notice?.tone} />
      {data.rules.length === 0 && (
        <p className="panel p-4 text-ink-600 dark:text-ink-300">
          No rules are saved, so Keelson schedules with its presets. Restore the presets to see and change them.
        </p>
      )}
      {(["calendar", "hours"] as const).map((ruleKind) => (
        <RuleTable
          key={ruleKind}
          ruleKind={ruleKind}
          rules={data.rules.filter((r) => r.kind === ruleKind)}
          onAdd={() => setOpen({ kind: "add", ruleKind })}
          onEdit={(rule) => setOpen({ kind: "edit", rule })}
          onDelete={(rule) => setOpen({ kind: "delete", rule })}
        />
      ))}

      {(open?.kind === "add" || open?.kind === "edit") && (
        <SidePanel
          title={open.kind === "add" ? "Add a tolerance rule" : `Edit “${open.rule.name}”`}
          subtitle={open.kind === "edit" ? matchesWords(open.rule) : "Work-order states follow within a minute."}
          onClose={() => setOpen(null)}
          closeOnBackdrop
        >
          <ToleranceRuleForm
            rule={open.kind === "edit" ? open.rule : undefined}
            kind={open.kind === "edit" ? open.rule.kind : open.ruleKind}
            onDone={done}
          />
          {open.kind === "edit" && (
            <div className="mt-4">
              <RecordTrail vesselId={null} table="tolerance_rule" record={open.rule.id} />
            </div>
          )}
        </SidePanel>
      )}
      {open?.kind === "delete" && (
        <ConfirmPanel
          title={`Delete “${open.rule.name}”?`}
          subtitle={matchesWords(open.rule)}
          confirmLabel="Delete rule"
          tone="alarm"
          onConfirm={async () => `“${(await remove.mutateAsync(open.rule.id)).deleted}” is deleted.`}
          onDone={done}
          onClose={() => setOpen(null)}
        >
          <p>
            Routines in its range take the next rule that covers them, or none: without a rule a work order has no
            window and no grace.
          </p>
          {open.rule.overridingRoutines > 0 && (
            <p>
              {open.rule.overridingRoutines === 1 ? "One routine has" : `${open.rule.overridingRoutines} routines have`}{" "}
              chosen this rule by hand; choose another rule on them first.
            </p>
          )}
        </ConfirmPanel>
      )}
    </section>
  );
}

type RuleTableProps = {
  ruleKind: ToleranceKind;
  rules: AdminToleranceRule[];
  onAdd: () => void;
  onEdit: (rule: AdminToleranceRule) => void;
  onDelete: (rule: AdminToleranceRule) => void;
};

function RuleTable({ ruleKind, rules, onAdd, onEdit, onDelete }: RuleTableProps) {
  const headingId = `rules-${ruleKind}`;
  const hours = ruleKind === "hours";
  const columns: DataColumn<AdminToleranceRule>[] = [
    {
      id: "name",
      header: "Name",
      cellClassName: "font-semibold",
      cell: (rule) => (
        <>
          {rule.name}
          {rule.overridingRoutines > 0 && (
            <span className="block text-xs font-normal text-ink-500 dark:text-ink-400">
              chosen on {rule.overridingRoutines === 1 ? "1 routine" : `${rule.overridingRoutines} routines`}
            </span>
          )}
        </>
      ),
    },
    { id: "matches", header: "Matches", cell: (rule) => matchesWords(rule) },
    { id: "window", header: "Window before", cell: (rule) => spanWords(rule.windowBefore) },
    { id: "grace", header: "Grace after", cell: (rule) => spanWords(rule.graceAfter) },
    ...(hours
      ? [
          {
            id: "cap",
            header: "Cap",
            align: "right",
            cellClassName: "whitespace-nowrap tabular-nums",
            cell: (rule) => (rule.capHours === null ? "none" : `${rule.capHours.toLocaleString("en-GB")} h`),
          } satisfies DataColumn<AdminToleranceRule>,
        ]
      : []),
    { id: "anniversary", header: "Keeps anniversary", cell: (rule) => (rule.keepsAnniversary ? "yes" : "no") },
    ...(hours
      ? []
      : [
          {
            id: "on-time",
            header: "Grace on time",
            cell: (rule) => (rule.graceOnTime ? "yes" : "no"),
          } satisfies DataColumn<AdminToleranceRule>,
        ]),
    {
      id: "actions",
      header: "Actions",
      hideHeader: true,
      cell: (rule) => (
        <div className="flex justify-end gap-1.5">
          <RowButton label="Edit" who={rule.name} onClick={() => onEdit(rule)} />
          <RowButton label="Delete" who={rule.name} onClick={() => onDelete(rule)} />
        </div>
      ),
    },
  ];
  return (
    <section aria-labelledby={headingId}>
      <div className="mb-2 flex items-end justify-between gap-3">
        <h3 id={headingId} className="text-sm font-semibold">
          {KIND_HEADING[ruleKind]}
        </h3>
        <button type="button" className="btn-quiet px-2 py-1 text-xs" onClick={onAdd}>
          Add {hours ? "running-hours" : "calendar"} rule
        </button>
      </div>
      <DataTable
        columns={columns}
        rows={rules}
        rowKey={(rule) => rule.id}
        labelledBy={headingId}
        density="compact"
        empty={`No ${hours ? "running-hours" : "calendar"} rules: routines of this kind get no window and no grace.`}
      />
    </section>
  );
}
