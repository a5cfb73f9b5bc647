// The Fleet board's answer (GET /api/fleet/board), shared by the route handler and the page.
// Kept light for the office's link: figures per vessel, trends as bare number arrays aligned to
// one list of days.

import type { DeferralListItem } from "@/server/deferrals/contract";

export type BoardTier = 0 | 1 | 2 | 3 | 4;

export type FleetBoardVessel = {
  id: string;
  name: string;
  code: string;
  /** The UTC day of the figures shown (today's snapshot, else the latest); null with none yet. */
  day: string | null;
  scheduled: number;
  windowOpen: number;
  late: number;
  outOfTolerance: number;
  deferred: number;
  criticalLate: number;
  criticalOutOfTolerance: number;
  classLate: number;
  classOutOfTolerance: number;
  lastReadingAt: string | null;
  daysSinceReading: number | null;
  /** No reading for longer than the company's missing-readings hours (or none at all). */
  stoppedReporting: boolean;
  completed90: number;
  /** 0–1; null with no completion in the last 90 days. */
  onTimeRate: number | null;
  /** Requests awaiting a decision now. */
  pendingDeferrals: number;
  /** Requisitions sent to the office or ordered, not yet delivered. */
  openRequisitions: number;
  /** Defect reports not yet closed; those on critical equipment; days since the oldest was found. */
  openDefects: number;
  criticalDefects: number;
  oldestDefectDays: number | null;
  /** 0 critical/class out of tolerance, 1 critical/class late, 2 out of tolerance, 3 late, 4 none. */
  tier: BoardTier;
  /** Late + out of tolerance on each of `FleetBoard.days`; null where no snapshot was taken. */
  trend: (number | null)[];
};

export type FleetBoardPending = {
  id: string;
  vessel: { id: string; name: string; code: string };
  workOrder: DeferralListItem["workOrder"];
  proposedDueDay: string | null;
  proposedDueHours: number | null;
  needsOffice: boolean;
  requestedBy: string | null;
  requestedAt: string;
  /** Why the chief engineer asks. */
  reason: string;
  /** The counter the work order runs on, with its running rate: is the machine really on stand-by? */
  counter: { name: string; hoursPerDay: number | null; basis: "measured" | "planned" | null; lastReadAt: string | null } | null;
  /** This person may decide it here (the office decides critical and class work). */
  mayDecide: boolean;
};

export type FleetBoard = {
  generatedAt: string;
  missingReadingsHours: number;
  /** The 90 UTC days of the trends, oldest first. */
  days: string[];
  /** In the board's order (server/fleet/figures.ts `compareForBoard`). */
  vessels: FleetBoardVessel[];
  /** The fleet's sums per day of `days`; null where no vessel had a snapshot. */
  fleet: {
    outOfTolerance: (number | null)[];
    late: (number | null)[];
    /** On-time share of all the fleet's completions of the 90 days before each day, 0–1. */
    onTimeRate: (number | null)[];
  };
  /** Oldest request last, as the deferral lists order them (newest first). */
  pendingDeferrals: FleetBoardPending[];
};
