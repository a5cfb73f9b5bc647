// The cells of an import row read into the values the contracts take: yes/no, numbers with a decimal
// comma, teams in words, measurements, lists. Each reader answers a value or a problem sentence.
import { RANKS, type Rank } from "@/server/routines/ranks";
import { RANK_LABEL, type RankNames } from "@/server/routines/rank-names";
import { CAUTIONS } from "@/server/routines/contract";
import type { RoutineCaution, RoutineMeasurement } from "@/db/schema/maintenance";
import { instantOfShipTime } from "@/server/format/hours";

export type Cell<T> = { value: T } | { problem: string };
const ok = <T>(value: T): Cell<T> => ({ value });
const no = (problem: string): Cell<never> => ({ problem });

const YES = new Set(["yes", "y", "true", "1", "x", "ja", "oui", "sí", "si"]);
const NO = new Set(["no", "n", "false", "0", "", "-", "nein", "non"]);

export function yesNo(raw: string | undefined): Cell<boolean> {
  const v = (raw ?? "").trim().toLowerCase();
  if (YES.has(v)) return ok(true);
  if (NO.has(v)) return ok(false);
  return no(`write yes or no, not “${raw}”.`);
}

/** A number as typed; with `decimalComma` "12,5" is 12.5. Empty: undefined. */
export function numberCell(raw: string | undefined, decimalComma: boolean): string | undefined {
  const v = (raw ?? "").trim().replace(/\s/g, "");
  if (!v) return undefined;
  return decimalComma ? v.replace(/\./g, "").replace(",", ".") : v.replace(/,(?=\d{3}(\D|$))/g, "");
}

/** "second engineer; motorman x2" (or ×2, or "2 motorman") → the team, by Keelson's rank or the company's name for it. */
export function teamCell(raw: string | undefined, names: RankNames = {}): Cell<{ rank: Rank; count: number }[]> {
  const text = (raw ?? "").trim();
  if (!text) return no("say who does the job, e.g. “second engineer; motorman x2”.");
  const byWord = new Map<string, Rank>();
  for (const rank of RANKS) {
    byWord.set(rank, rank);
    byWord.set(rank.replaceAll("-", " "), rank);
    byWord.set(RANK_LABEL[rank].toLowerCase(), rank);
    const own = names[rank];
    if (own) byWord.set(own.toLowerCase(), rank);
  }
  byWord.set("electrician", "electro-technical-officer");
  byWord.set("eto", "electro-technical-officer");
  const team: { rank: Rank; count: number }[] = [];
  for (const part of text.split(/[;+]|\n/).map((p) => p.trim()).filter(Boolean).slice(0, 20)) {
    const m = /^(?:(\d{1,2})\s*[x×]?\s+)?(.+?)(?:\s*[x×]\s*(\d{1,2}))?$/i.exec(part);
    const word = (m?.[2] ?? part).trim().toLowerCase().replace(/s$/, "");
    const rank = byWord.get(word) ?? byWord.get(`${word}s`) ?? byWord.get((m?.[2] ?? "").trim().toLowerCase());
    if (!rank) {
      return no(`“${part}” is not a rank Keelson knows: use ${RANKS.map((r) => RANK_LABEL[r].toLowerCase()).join(", ")}.`);
    }
    team.push({ rank, count: Number(m?.[3] ?? m?.[1] ?? 1) });
  }
  return ok(team);
}

/** "Liner wear [mm] 0..1.6 | Ring gap [mm] ..2.1 | Temperature [°C]" */
export function measurementsCell(raw: string | undefined, decimalComma: boolean): Cell<RoutineMeasurement[]> {
  const text = (raw ?? "").trim();
  if (!text) return ok([]);
  const out: RoutineMeasurement[] = [];
  for (const part of text.split(/\||\n/).map((p) => p.trim()).filter(Boolean).slice(0, 60)) {
    const m = /^([^[\]]+?)\s*(?:\[([^\]]{0,20})\])?\s*(?:(\S*)\s*\.\.\s*(\S*))?$/.exec(part);
    const number = /^-?\d+([.,]\d+)?$/;
    if (!m || !m[1] || m[1].includes("..") || [m[3], m[4]].some((v) => v && !number.test(v))) {
      return no(`“${part}” is not a measurement: write name [unit] lower..upper, e.g. “Liner wear [mm] 0..1.6”.`);
    }
    const limit = (v: string | undefined) => {
      const n = numberCell(v, decimalComma);
      return n === undefined ? null : Number(n);
    };
    const lower = limit(m[3]);
    const upper = limit(m[4]);
    if ((lower !== null && !Number.isFinite(lower)) || (upper !== null && !Number.isFinite(upper))) {
      return no(`“${part}”: the limits must be numbers, e.g. 0..1.6.`);
    }
    out.push({ name: m[1].trim(), unit: (m[2] ?? "").trim(), lower, upper });
  }
  return ok(out);
}

/** Steps separated by | or by lines in the cell. */
export function listCell(raw: string | undefined, separator: RegExp = /\||\n/): string[] {
  return (raw ?? "")
    .split(separator)
    .map((s) => s.trim())
    .filter(Boolean);
}

export function cautionsCell(raw: string | undefined): Cell<RoutineCaution[]> {
  const words = listCell(raw, /[;,|\n]/).map((w) => w.toLowerCase().replace(/\s+/g, "-"));
  const unknown = words.filter((w) => !(CAUTIONS as readonly string[]).includes(w));
  if (unknown.length) return no(`${unknown.map((u) => `“${u}”`).join(", ")}: cautions are ${CAUTIONS.join(", ")}.`);
  return ok(CAUTIONS.filter((c) => words.includes(c)));
}

const pad2 = (n: string) => n.padStart(2, "0");
const INSTANT = /^(\d{4})-(\d{1,2})-(\d{1,2})[T\s]+(\d{1,2}):(\d{2})(?::\d{2}(?:\.\d+)?)?\s*(Z|[+-]\d{2}(?::?\d{2})?)?$/i;

/**
 * The zone's rules read once per ship's day and clock: a readings history has the same 09:00 on
 * every counter, and working a zone's offset out is the costly part. Bounded: cleared when full.
 */
const shipTimes = new Map<string, number>();
function shipTimeOnce(day: string, clock: string, timeZone: string): number {
  const key = `${timeZone} ${day} ${clock}`;
  let at = shipTimes.get(key);
  if (at === undefined) {
    if (shipTimes.size >= 20_000) shipTimes.clear();
    at = instantOfShipTime(day, clock, timeZone).getTime();
    shipTimes.set(key, at);
  }
  return at;
}

/**
 * An instant: on the ship's clock ("2025-03-13 08:00", in the vessel's zone), or with its UTC
 * offset ("2025-03-13T08:00+04:00", "…Z") as another system exports it.
 */
export function instantCell(raw: string | undefined, timeZone: string): Cell<Date> {
  const t = (raw ?? "").trim();
  const words = `“${t}” is not a time Keelson reads: write the ship's time as YYYY-MM-DD HH:MM (e.g. 2025-03-13 08:00), or add its UTC offset (2025-03-13T08:00+04:00).`;
  if (!t) return no("Enter when it was read: the ship's time as YYYY-MM-DD HH:MM.");
  const m = INSTANT.exec(t);
  if (!m) return no(words);
  const [, y = "", mo = "", d = "", hh = "", mm = "", offset] = m;
  const day = `${y}-${pad2(mo)}-${pad2(d)}`;
  const date = new Date(`${day}T00:00:00Z`);
  if (Number.isNaN(date.getTime()) || !date.toISOString().startsWith(day)) return no(`“${t}”: ${day} is not a day of the calendar.`);
  if (Number(hh) > 23 || Number(mm) > 59) return no(`“${t}”: the time of day runs from 00:00 to 23:59.`);
  const clock = `${pad2(hh)}:${mm}`;
  if (!offset) return ok(new Date(shipTimeOnce(day, clock, timeZone)));
  const zone = offset.toUpperCase() === "Z" ? "Z" : offset.length === 3 ? `${offset}:00` : `${offset.slice(0, 3)}:${offset.slice(-2)}`;
  const at = new Date(`${day}T${clock}:00${zone}`);
  return Number.isNaN(at.getTime()) ? no(words) : ok(at);
}
