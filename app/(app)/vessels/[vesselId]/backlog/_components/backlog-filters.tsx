"use client";

import { StateBadge } from "@/app/_components/state-badge";
import {
  ALL_STATES,
  type BacklogFilter,
  type BacklogPage,
  type BacklogState,
  OPEN_STATES,
} from "@/server/backlog/contract";
import { useRankWords } from "@/app/_components/rank-words-provider";

/** The filters this bar sets, in the Backlog query's own shape (a value left out is no filter). */
export type FilterValues = Pick<
  BacklogFilter,
  "state" | "q" | "rank" | "critical" | "classRelated" | "engineStop" | "defects" | "dueBefore"
>;

type Props = {
  values: FilterValues;
  counts: BacklogPage["counts"] | undefined;
  ranks: string[];
  onChange: (next: Partial<FilterValues>) => void;
};

/** Controlled by the caller's filter values, which follow the URL (or the change just made). */
export function BacklogFilters({ values, counts, ranks, onChange }: Props) {
  const { label: rankLabel } = useRankWords();
  const toggleState = (s: BacklogState) => {
    const has = values.state.includes(s);
    const next = has ? values.state.filter((x) => x !== s) : [...values.state, s];
    onChange({ state: next.length ? next : [...OPEN_STATES] });
  };
  return (
    <div className="grid gap-3 border-b border-ink-200 p-4 dark:border-ink-800">
      <fieldset>
        <legend className="label">State</legend>
        <div className="flex flex-wrap gap-2">
          {ALL_STATES.map((s) => (
            <label
              key={s}
              className="flex cursor-pointer items-center gap-1.5 rounded-md border border-transparent px-1 py-0.5 has-[:checked]:border-ink-300 has-[:checked]:bg-ink-50 dark:has-[:checked]:border-ink-600 dark:has-[:checked]:bg-ink-850"
            >
              <input
                type="checkbox"
                checked={values.state.includes(s)}
                onChange={() => toggleState(s)}
                className="accent-tide-600"
              />
              <StateBadge state={s} />
              <span className="text-xs text-ink-500 tabular-nums">{counts ? counts[s] : "…"}</span>
            </label>
          ))}
        </div>
      </fieldset>
      <div className="flex flex-wrap items-end gap-3">
        <div>
          <label htmlFor="backlog-q" className="label">
            Find
          </label>
          <input
            id="backlog-q"
            type="search"
            className="field w-56"
            placeholder="Title, number or code"
            defaultValue={values.q ?? ""}
            onKeyDown={(e) => e.key === "Enter" && onChange({ q: e.currentTarget.value })}
            onBlur={(e) => e.currentTarget.value !== (values.q ?? "") && onChange({ q: e.currentTarget.value })}
          />
        </div>
        <div>
          <label htmlFor="backlog-rank" className="label">
            Rank
          </label>
          <select
            id="backlog-rank"
            className="field w-44"
            value={values.rank ?? ""}
            onChange={(e) => onChange({ rank: e.target.value })}
          >
            <option value="">Any rank</option>
            {ranks.map((r) => (
              <option key={r} value={r}>
                {rankLabel(r)}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="backlog-due" className="label">
            Due on or before
          </label>
          <input
            id="backlog-due"
            type="date"
            className="field w-40"
            value={values.dueBefore ?? ""}
            onChange={(e) => onChange({ dueBefore: e.target.value })}
          />
        </div>
        {(
          [
            ["critical", "Critical only"],
            ["classRelated", "Class items only"],
            ["engineStop", "Engine stop needed"],
            ["defects", "Defects only"],
          ] as const
        ).map(([key, label]) => (
          <label key={key} className="flex items-center gap-1.5 pb-1.5">
            <input
              type="checkbox"
              className="accent-tide-600"
              checked={values[key] ?? false}
              onChange={(e) => onChange({ [key]: e.target.checked })}
            />
            {label}
          </label>
        ))}
      </div>
    </div>
  );
}
