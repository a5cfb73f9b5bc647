"use client";
// A job on the timeline: one block per working period in each of its people's lanes, the same colour
// throughout. The first block is the job's control (a button the arrow keys move and the pointer
// drags); the others repeat it for the eye only, and follow a drag.
import { useRef, useState } from "react";
import { useRankWords } from "@/app/_components/rank-words-provider";
import type { RankWords } from "@/server/routines/rank-names";
import type { PlacedView } from "@/server/port-stays/contract";
import { personLabel, shipClockLabel } from "../../_components/stay-words";

/** Light fills that dark text reads on at 4.5:1 or more, in both themes. */
const FILLS = ["#a8dce5", "#f3d58a", "#c9e7b5", "#f2c2c9", "#d5c8f0", "#f7c99b", "#b9d3f0", "#e3e3a0"];
export const fillOf = (index: number) => FILLS[index % FILLS.length]!;

export type BlockPlace = { left: number; width: number; top: number; height: number };

type Props = {
  job: PlacedView;
  colour: string;
  places: BlockPlace[];
  problem?: string;
  /** The job's draft start on the ship's clock (it differs from the placed one while refused). */
  wanted: string;
  onKey?: (key: string, shift: boolean) => boolean;
  /** Dropped after a drag: where the first block's left edge now is (px on the timeline). */
  onDrop?: (left: number) => void;
};

/** Pixels a pointer must travel before a press becomes a drag (a plain click moves nothing). */
const DRAG_PX = 4;

export function jobWords(job: PlacedView, ranks: RankWords): string {
  const people = job.people.map((p) => personLabel(p, ranks)).join(", ");
  return `${job.number} ${job.title}, ${shipClockLabel(job.startLocal)} for ${job.elapsedHours} h, ${people}${job.needsEngineStop ? ", engine stopped" : ""}`;
}

/** A narrow block shows the number's last part ("00104"); the whole is in its title and name. */
const shown = (number: string, width: number) => (width < 96 ? (number.split("-").pop() ?? number) : number);

export function JobBlock({ job, colour, places, problem, wanted, onKey, onDrop }: Props) {
  const words = jobWords(job, useRankWords());
  const [offset, setOffset] = useState(0);
  const drag = useRef<{ x: number; moved: boolean } | null>(null);
  const [first, ...rest] = places;
  if (!first) return null;
  const ring = problem ? "ring-2 ring-alarm-600 ring-offset-1 dark:ring-alarm-300" : "";
  const shared = `absolute overflow-hidden rounded border border-ink-800/40 px-1 text-left text-xs leading-6 font-semibold text-ink-950 ${ring}`;
  const style = (p: BlockPlace) => ({
    left: p.left + offset,
    width: Math.max(p.width, 24),
    top: p.top,
    height: p.height,
    backgroundColor: colour,
    ...(onDrop ? { touchAction: "none" as const } : {}),
  });
  const dragging = onDrop && {
    onPointerDown: (e: React.PointerEvent<HTMLButtonElement>) => {
      if (e.button !== 0) return;
      drag.current = { x: e.clientX, moved: false };
      e.currentTarget.setPointerCapture(e.pointerId);
    },
    onPointerMove: (e: React.PointerEvent<HTMLButtonElement>) => {
      const d = drag.current;
      if (!d) return;
      if (Math.abs(e.clientX - d.x) > DRAG_PX) d.moved = true;
      if (d.moved) setOffset(e.clientX - d.x);
    },
    onPointerUp: (e: React.PointerEvent<HTMLButtonElement>) => {
      const d = drag.current;
      drag.current = null;
      setOffset(0);
      if (d?.moved) onDrop(first!.left + e.clientX - d.x);
    },
    onPointerCancel: () => {
      drag.current = null;
      setOffset(0);
    },
  };
  const facts = {
    "data-work-order": job.number,
    "data-start": job.start,
    "data-end": job.end,
    "data-start-local": wanted,
    "data-engine-stop": job.needsEngineStop ? "true" : "false",
    "data-problem": problem ? "true" : undefined,
  };
  return (
    <>
      {onKey ? (
        <button
          type="button"
          className={`${shared} ${onDrop ? "cursor-grab active:cursor-grabbing" : ""} focus-visible:z-20 ${offset ? "z-30 opacity-80 shadow-lg" : ""}`}
          style={style(first)}
          title={problem ? `${words}. ${problem}` : words}
          aria-label={`${words}.${problem ? ` Problem: ${problem}` : ""} Drag it, or move it with the arrow keys, Shift by the hour, Page Up and Page Down by the day.`}
          onKeyDown={(e) => {
            if (onKey(e.key, e.shiftKey)) e.preventDefault();
          }}
          {...dragging}
          {...facts}
        >
          {problem && <span aria-hidden="true">⚠ </span>}
          {shown(job.number, first.width)}
        </button>
      ) : (
        <div role="img" className={shared} style={style(first)} title={words} aria-label={words} {...facts}>
          {shown(job.number, first.width)}
        </div>
      )}
      {rest.map((p, i) => (
        <div key={i} aria-hidden="true" className={shared} style={style(p)} title={words}>
          {shown(job.number, p.width)}
        </div>
      ))}
    </>
  );
}
