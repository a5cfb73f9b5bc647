"use client";
// The package the chief is shaping on the timeline. Every change (a move, a job removed or added
// back) sends the whole draft to package/check, and the timeline redraws from the answer: the server
// alone knows the working periods, the watches and who is free, so the browser never guesses them.
import { useRef, useState } from "react";
import { ProblemError } from "@/app/_components/fetch-json";
import type { PackageJob, PackageProblem, PlacedView, ProposalView } from "@/server/port-stays/contract";
import { checkPackage } from "../../_components/use-port-stays";
import { movedReason, shiftLocal } from "./timeline-geometry";

export type DraftInput = { workOrderId: string; start: string; people?: string[]; reason?: string };
/** One job of the draft: what is sent, and where the server last placed it (null until it has). */
export type DraftEntry = { input: DraftInput; job: PackageJob; placed: PlacedView | null };
/** A job out of the draft that may go back in. */
export type Outside = { job: PackageJob; message: string };

const inputOf = (p: PlacedView): DraftInput => ({ workOrderId: p.workOrderId, start: p.startLocal, people: p.people, reason: p.reason });

export function usePackageDraft(vesselId: string, stayId: string) {
  const [entries, setEntries] = useState<DraftEntry[]>([]);
  const [outside, setOutside] = useState<Outside[]>([]);
  const [problems, setProblems] = useState<PackageProblem[]>([]);
  const [said, setSaid] = useState("");
  const [checking, setChecking] = useState(false);
  // Only the answer to the latest check is drawn: key presses may outrun the server.
  const asked = useRef(0);

  function start(proposal: ProposalView) {
    setEntries(proposal.items.map((p) => ({ input: inputOf(p), job: p, placed: p })));
    setOutside(proposal.leftOut.map((l) => ({ job: l, message: l.message })));
    setProblems([]);
    setSaid("");
  }

  async function check(next: DraftEntry[], what: string) {
    setEntries(next);
    const n = ++asked.current;
    setChecking(true);
    try {
      const answer = await checkPackage(vesselId, stayId, { items: next.map((e) => e.input) });
      if (n !== asked.current) return;
      const placed = new Map(answer.items.map((p) => [p.workOrderId, p]));
      setEntries(next.map((e) => ({ ...e, placed: placed.get(e.input.workOrderId) ?? e.placed })));
      setProblems(answer.problems);
      const first = answer.problems[0];
      setSaid(first ? `${what}: ${first.message}` : `${what}: fits.`);
    } catch (error) {
      if (n !== asked.current) return;
      setSaid(`${what}: not checked (${error instanceof ProblemError ? error.problem.detail : "no answer from the server"}).`);
    } finally {
      if (n === asked.current) setChecking(false);
    }
  }

  function move(workOrderId: string, minutes: number) {
    const entry = entries.find((e) => e.input.workOrderId === workOrderId);
    if (entry) moveTo(workOrderId, shiftLocal(entry.input.start, minutes));
  }

  /** The job to start at a ship's clock time ("2026-12-10T08:00"): a drag ends here. */
  function moveTo(workOrderId: string, startAt: string) {
    const entry = entries.find((e) => e.input.workOrderId === workOrderId);
    if (!entry || entry.input.start === startAt) return;
    // The moved job is fitted around the others: it goes last in the draft (the server checks in
    // order) and the server picks whoever of its ranks is free then, so the jobs left where they
    // were keep their people and a move fails only when nobody of the team is free.
    // Its reason keeps why the job is in the package; when and by whom is now the chief's choice
    // (the proposal's "second engineer from 9 Dec 11:00 …" would be wrong on the printed sheet).
    const { people: _people, reason, ...rest } = entry.input;
    const moved = { ...entry, input: { ...rest, start: startAt, reason: movedReason(reason) } };
    const next = [...entries.filter((e) => e !== entry), moved];
    void check(next, `${entry.job.number} to start ${startAt.replace("T", " ")}`);
  }

  function remove(workOrderId: string) {
    const entry = entries.find((e) => e.input.workOrderId === workOrderId);
    if (!entry) return;
    setOutside((o) => [{ job: entry.job, message: "Taken out of the draft by hand." }, ...o]);
    void check(
      entries.filter((e) => e !== entry),
      `${entry.job.number} taken out`,
    );
  }

  /** Back into the draft at a start of the chief's choosing; the server picks the people. */
  function add(job: PackageJob, startAt: string) {
    setOutside((o) => o.filter((x) => x.job.workOrderId !== job.workOrderId));
    const entry: DraftEntry = { input: { workOrderId: job.workOrderId, start: startAt, reason: "Added to the package by hand." }, job, placed: null };
    void check([...entries, entry], `${job.number} added at ${startAt.replace("T", " ")}`);
  }

  /** The accept route's refusal, shown on the jobs as a check's problems are. */
  function refused(error: unknown): boolean {
    if (!(error instanceof ProblemError) || !error.problem.errors?.length) return false;
    const found = error.problem.errors.flatMap((e) => {
      const m = /^items\.(\d+)\.(start|people|workOrderId)$/.exec(e.field);
      return m ? [{ item: Number(m[1]), field: m[2] as PackageProblem["field"], message: e.message }] : [];
    });
    setProblems(found);
    setSaid(found[0] ? `Not accepted: ${found[0].message}` : error.problem.detail);
    return true;
  }

  return { entries, outside, problems, said, checking, start, move, moveTo, remove, add, refused, inputs: entries.map((e) => e.input) };
}

export type PackageDraft = ReturnType<typeof usePackageDraft>;

