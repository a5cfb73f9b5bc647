"use client";

import { useMemo, useState } from "react";
import { SearchField } from "@/app/_components/search-field";
import type { RegisterComponent, RegisterView } from "@/server/register/contract";
import { buildTree, matchesWithAncestors, type TreeNode } from "@/server/register/tree";
import { counterWords, type Lookup, lookupOf } from "./counter-words";

export type ComponentAction = "add-child" | "edit-component" | "move-component";

type Props = { view: RegisterView; onAction: (action: ComponentAction, component: RegisterComponent) => void };

export function ComponentTree({ view, onAction }: Props) {
  const roots = useMemo(() => buildTree(view.components), [view.components]);
  const lookup = useMemo(() => lookupOf(view), [view]);
  // Open or closed as the user left each node; untouched, the top level shows its first parts.
  const [open, setOpen] = useState<Record<string, boolean>>({});
  const [filter, setFilter] = useState("");
  const needle = filter.trim().toLowerCase();
  const shown = useMemo(
    () =>
      needle
        ? matchesWithAncestors(
            view.components,
            (c) => c.code.toLowerCase().includes(needle) || c.name.toLowerCase().includes(needle),
          )
        : null,
    [needle, view.components],
  );
  const isOpen = (node: TreeNode<RegisterComponent>) => (shown ? true : (open[node.row.id] ?? node.depth === 0));
  const setAll = (value: boolean) => setOpen(Object.fromEntries(view.components.map((c) => [c.id, value])));

  return (
    <section className="panel" aria-labelledby="tree-heading">
      <div className="flex flex-wrap items-center gap-2 border-b border-ink-200 px-4 py-3 dark:border-ink-800">
        <h2 id="tree-heading" className="mr-auto font-semibold">
          Components <span className="font-normal text-ink-500">({view.components.length})</span>
        </h2>
        <SearchField
          label="Find a component by code or name"
          placeholder="Find code or name…"
          value={filter}
          onChange={setFilter}
        />
        <button type="button" className="btn-quiet px-2 py-1" onClick={() => setAll(true)} disabled={Boolean(shown)}>
          Expand all
        </button>
        <button type="button" className="btn-quiet px-2 py-1" onClick={() => setAll(false)} disabled={Boolean(shown)}>
          Collapse all
        </button>
      </div>
      {shown && shown.size === 0 ? (
        <p className="px-4 py-6 text-center text-ink-500">No component’s code or name contains “{filter.trim()}”.</p>
      ) : (
        <ul className="py-1">
          {roots
            .filter((n) => !shown || shown.has(n.row.id))
            .map((node) => (
              <ComponentNode
                key={node.row.id}
                node={node}
                lookup={lookup}
                vesselId={view.vessel.id}
                canEdit={view.canEdit}
                isOpen={isOpen}
                shown={shown}
                onToggle={(id, value) => setOpen((o) => ({ ...o, [id]: value }))}
                onAction={onAction}
              />
            ))}
        </ul>
      )}
    </section>
  );
}

type NodeProps = {
  node: TreeNode<RegisterComponent>;
  lookup: Lookup;
  vesselId: string;
  canEdit: boolean;
  isOpen: (node: TreeNode<RegisterComponent>) => boolean;
  shown: Set<string> | null;
  onToggle: (id: string, open: boolean) => void;
  onAction: Props["onAction"];
};

function ComponentNode({ node, lookup, vesselId, canEdit, isOpen, shown, onToggle, onAction }: NodeProps) {
  const c = node.row;
  const children = node.children.filter((n) => !shown || shown.has(n.row.id));
  const expanded = children.length > 0 && isOpen(node);
  const counter = counterWords(c.effectiveCounter, lookup);
  const groupId = `parts-of-${c.id}`;
  const action = (kind: ComponentAction, label: string) => (
    <button
      type="button"
      className="rounded px-1.5 py-0.5 text-xs font-semibold text-tide-700 hover:bg-tide-50 dark:text-tide-300 dark:hover:bg-tide-900/40"
      aria-label={`${label} ${c.code}`}
      onClick={() => onAction(kind, c)}
    >
      {label}
    </button>
  );

  return (
    <li>
      <div
        className="group grid items-start gap-x-3 gap-y-0.5 py-1.5 pr-3 hover:bg-ink-50 sm:grid-cols-[minmax(0,1fr)_15rem_auto] dark:hover:bg-ink-850"
        style={{ paddingLeft: `${0.5 + node.depth * 1.25}rem` }}
      >
        <div className="flex min-w-0 items-start gap-1.5">
          {children.length > 0 ? (
            <button
              type="button"
              className="mt-px flex size-5 shrink-0 items-center justify-center rounded text-ink-500 hover:bg-ink-200 hover:text-ink-900 dark:hover:bg-ink-700 dark:hover:text-ink-50"
              aria-expanded={expanded}
              aria-controls={expanded ? groupId : undefined}
              aria-label={`${c.code} ${c.name}: ${children.length} part${children.length === 1 ? "" : "s"}`}
              onClick={() => onToggle(c.id, !expanded)}
            >
              <svg
                viewBox="0 0 10 10"
                className={`size-2.5 transition-transform ${expanded ? "rotate-90" : ""}`}
                aria-hidden="true"
              >
                <path
                  d="M3 1.5 7 5 3 8.5"
                  fill="none"
                  stroke="currentColor"
                  strokeWidth="1.6"
                  strokeLinecap="round"
                  strokeLinejoin="round"
                />
              </svg>
            </button>
          ) : (
            <span className="size-5 shrink-0" aria-hidden="true" />
          )}
          <div className="min-w-0">
            <span className="mr-2 font-mono font-semibold text-ink-900 dark:text-ink-50">{c.code}</span>
            <span className="mr-2">{c.name}</span>
            {c.critical && <CriticalMark />}
            {c.classItemRef && (
              <span className="text-xs whitespace-nowrap text-ink-500 dark:text-ink-400">
                class <span className="font-mono">{c.classItemRef}</span>
              </span>
            )}
          </div>
        </div>
        <p
          className={`pl-6.5 text-xs sm:pt-0.5 sm:pl-0 ${
            counter.none
              ? "text-ink-500 italic"
              : counter.inherited
                ? "text-ink-500 dark:text-ink-400"
                : "font-medium text-ink-700 dark:text-ink-200"
          }`}
        >
          <span className="sr-only">Counter: </span>
          {counter.text}
        </p>
        <div className="flex gap-0.5 pl-5 sm:pl-0 pointer-fine:opacity-0 pointer-fine:group-focus-within:opacity-100 pointer-fine:group-hover:opacity-100">
          {canEdit && action("add-child", "Add part")}
          {canEdit && action("edit-component", "Edit")}
          {canEdit && action("move-component", "Move")}
          <a
            className="rounded px-1.5 py-0.5 text-xs font-semibold text-tide-700 hover:bg-tide-50 dark:text-tide-300 dark:hover:bg-tide-900/40"
            href={`/api/vessels/${vesselId}/export/history?component=${encodeURIComponent(c.code)}`}
            aria-label={`History of ${c.code} as CSV`}
            download
          >
            History
          </a>
        </div>
      </div>
      {expanded && (
        <ul id={groupId}>
          {children.map((child) => (
            <ComponentNode
              key={child.row.id}
              node={child}
              lookup={lookup}
              vesselId={vesselId}
              canEdit={canEdit}
              isOpen={isOpen}
              shown={shown}
              onToggle={onToggle}
              onAction={onAction}
            />
          ))}
        </ul>
      )}
    </li>
  );
}

/** Said in words with a sign beside it, never by colour alone. */
function CriticalMark() {
  return (
    <span className="mr-2 inline-flex items-center gap-1 rounded border border-brass-400 bg-brass-100 px-1.5 text-xs font-semibold text-brass-700 dark:border-brass-600 dark:bg-brass-700/20 dark:text-brass-300">
      <svg viewBox="0 0 12 12" className="size-3" aria-hidden="true">
        <path d="M6 1 11 10.5H1Z" fill="none" stroke="currentColor" strokeWidth="1.4" strokeLinejoin="round" />
        <path d="M6 4.5v2.6M6 8.6v.1" stroke="currentColor" strokeWidth="1.4" strokeLinecap="round" />
      </svg>
      critical
    </span>
  );
}
