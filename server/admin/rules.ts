// The company administrator's rules that need no database: pure, unit-tested beside this file.
import { type Role, seesWholeFleet } from "@/server/auth/roles";
import type { FieldError } from "@/server/http/problem";

export type ExistingVessel = { id: string; name: string; code: string; imoNumber: string; retiredAt: Date | null };

/**
 * Code and IMO number are unique within a company, retired vessels included: a work-order number
 * (WO-<code>-<sequence>) and a ship's IMO number must keep pointing at one vessel in the records.
 */
export function duplicateVesselErrors(
  candidate: { code?: string; imoNumber?: string },
  existing: ExistingVessel[],
  selfId?: string,
): FieldError[] {
  const others = existing.filter((v) => v.id !== selfId);
  const label = (v: ExistingVessel) => (v.retiredAt ? `${v.name} (retired)` : v.name);
  const errors: FieldError[] = [];
  const sameCode = candidate.code ? others.find((v) => v.code === candidate.code) : undefined;
  if (sameCode)
    errors.push({ field: "code", message: `Code ${candidate.code} is already used by ${label(sameCode)}.` });
  const sameImo = candidate.imoNumber ? others.find((v) => v.imoNumber === candidate.imoNumber) : undefined;
  if (sameImo) {
    errors.push({
      field: "imoNumber",
      message: `IMO ${candidate.imoNumber} is already registered as ${label(sameImo)}.`,
    });
  }
  return errors;
}

export type CompanyAdmin = { userId: string; disabled: boolean };

/**
 * A company always keeps one administrator who can sign in: otherwise nobody can add people,
 * vessels or reset a password, and the company is locked out of its own records.
 */
export function lastAdminError(
  admins: CompanyAdmin[],
  targetUserId: string,
  change: { role?: Role; disabled?: boolean },
  actingUserId: string,
): FieldError | null {
  const after = admins.filter((a) => {
    if (a.userId !== targetUserId) return !a.disabled;
    if (change.role !== undefined && change.role !== "admin") return false;
    return !(change.disabled ?? a.disabled);
  });
  if (after.length > 0) return null;
  const demoted = change.role !== undefined && change.role !== "admin";
  const field = demoted ? "role" : "disabled";
  if (targetUserId === actingUserId) {
    return {
      field,
      message: `You are the company’s only active administrator: make someone else an administrator before you ${demoted ? "give up the role" : "disable yourself"}.`,
    };
  }
  return {
    field,
    message: `This is the company’s only active administrator: make someone else an administrator before you ${demoted ? "change their role" : "disable them"}.`,
  };
}

type VesselStaffing = { id: string; name: string; retiredAt: string | null; assignedPeople: number };
type PersonReach = { id: string; name: string; role: Role; disabled: boolean; vessels: unknown[]; isYou: boolean };

/**
 * What an administrator usually comes to fix: a vessel in service nobody on board is assigned to
 * (nobody can enter its Hour log), an active seagoing person who sees no vessel, and a company
 * with a single active administrator (nobody stands in during leave).
 */
export function companyGaps(vessels: VesselStaffing[], people: PersonReach[]) {
  const active = people.filter((p) => !p.disabled);
  const admins = active.filter((p) => p.role === "admin");
  return {
    unstaffedVessels: vessels.filter((v) => !v.retiredAt && v.assignedPeople === 0),
    peopleWithoutVessel: active.filter((p) => !seesWholeFleet(p.role) && p.vessels.length === 0),
    soleAdmin: admins.length === 1 ? admins[0]! : null,
  };
}

/** A password the administrator can read out or hand over: four short words and a three-digit number, joined by hyphens. */
export function suggestPassword(randomInts: (count: number) => number[]): string {
  const picks = randomInts(5);
  const chosen = picks.slice(0, 4).map((n) => WORDS[n % WORDS.length]!);
  return `${chosen.join("-")}-${100 + ((picks[4] ?? 0) % 900)}`;
}

// Plain words from the engine room and the sea, easy to spell over a radio or a bad phone line.
const WORDS = [
  "anchor",
  "ballast",
  "beacon",
  "bilge",
  "bollard",
  "bosun",
  "bridge",
  "buoy",
  "cable",
  "capstan",
  "cargo",
  "channel",
  "coral",
  "crane",
  "current",
  "davit",
  "deck",
  "delta",
  "dock",
  "dune",
  "ebb",
  "estuary",
  "fathom",
  "fender",
  "ferry",
  "flare",
  "gale",
  "galley",
  "gantry",
  "harbour",
  "hatch",
  "helm",
  "hull",
  "inlet",
  "island",
  "jetty",
  "keel",
  "knot",
  "lagoon",
  "lantern",
  "ledger",
  "lighter",
  "marina",
  "mast",
  "mooring",
  "north",
  "ocean",
  "orbit",
  "pier",
  "pilot",
  "piston",
  "propeller",
  "quay",
  "reef",
  "rudder",
  "salvage",
  "sextant",
  "shoal",
  "signal",
  "sound",
  "spray",
  "starboard",
  "stern",
  "strait",
  "swell",
  "tackle",
  "tanker",
  "tide",
  "tiller",
  "turbine",
  "valve",
  "voyage",
  "wake",
  "winch",
  "wharf",
  "yard",
] as const;
