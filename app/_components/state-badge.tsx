import type { BacklogState } from "@/server/backlog/contract";

// Each state is said in words and drawn with its own glyph, so it never rests on colour alone.
const LOOK: Record<BacklogState, { label: string; glyph: string; className: string }> = {
  scheduled: {
    label: "scheduled",
    glyph: "○",
    className: "border-ink-300 text-ink-700 dark:border-ink-600 dark:text-ink-200",
  },
  "window-open": {
    label: "window open",
    glyph: "◐",
    className: "border-tide-400 bg-tide-50 text-tide-800 dark:border-tide-500 dark:bg-tide-900/40 dark:text-tide-100",
  },
  late: {
    label: "late",
    glyph: "▲",
    className:
      "border-brass-400 bg-brass-100 text-brass-700 dark:border-brass-500 dark:bg-brass-700/30 dark:text-brass-100",
  },
  "out-of-tolerance": {
    label: "out of tolerance",
    glyph: "■",
    className:
      "border-alarm-500 bg-alarm-50 text-alarm-700 dark:border-alarm-500 dark:bg-alarm-700/30 dark:text-alarm-100",
  },
  deferred: {
    label: "deferred",
    glyph: "↷",
    className: "border-ink-400 bg-ink-100 text-ink-700 dark:border-ink-500 dark:bg-ink-800 dark:text-ink-100",
  },
  done: {
    label: "done",
    glyph: "✓",
    className: "border-go-500 bg-go-50 text-go-700 dark:border-go-500 dark:bg-go-700/30 dark:text-go-100",
  },
};

export function stateLabel(state: BacklogState): string {
  return LOOK[state].label;
}

export function StateBadge({ state }: { state: BacklogState }) {
  const look = LOOK[state];
  return (
    <span
      data-state={state}
      className={`inline-flex items-center gap-1 rounded border px-1.5 py-0.5 text-xs font-semibold whitespace-nowrap ${look.className}`}
    >
      <span aria-hidden="true">{look.glyph}</span>
      {look.label}
    </span>
  );
}
