// Demo port stays: for each vessel, the next two invented port calls with the crew on board, the
// working day and the engine-stop slot, so the chief engineer has a stay to plan. Ports, dates and figures are made up.
import { TZDate } from "@date-fns/tz";
import { addDays, format } from "date-fns";
import type { Tx } from "../client";
import * as s from "../schema";
import { instantOfShipTime } from "../../server/format/hours";
import type { DemoVessel } from "./scenario";

type DemoStay = {
  port: string;
  /** Ship's days from today to the arrival, and the stay's length in days. */
  inDays: number;
  days: number;
  arrive: string;
  depart: string;
  /** Hours the main engine may be immobilised from arrival; null when it stays on standby. */
  engineStopHours: number | null;
  /** The working day on board during the call ("HH:mm"). */
  workday: [string, string];
  remarks: string;
};

const STAYS: Record<string, DemoStay[]> = {
  AG: [
    {
      port: "Port Kelang (demo call)",
      inDays: 3,
      days: 2,
      arrive: "07:00",
      depart: "19:00",
      // The whole call: arrival to departure.
      engineStopHours: 36,
      workday: ["07:00", "19:00"],
      remarks: "Discharge at the container terminal; main engine may be immobilised with the harbour master's consent.",
    },
    {
      port: "Laem Chabang (demo call)",
      inDays: 19,
      days: 1,
      arrive: "06:00",
      depart: "22:00",
      engineStopHours: null,
      workday: ["07:00", "19:00"],
      remarks: "Short call; engine on standby throughout.",
    },
  ],
  CN: [
    {
      port: "Rotterdam Waalhaven (demo call)",
      inDays: 4,
      days: 3,
      arrive: "08:00",
      depart: "17:00",
      engineStopHours: 36,
      workday: ["07:00", "19:00"],
      remarks: "Berth 4; immobilisation permit requested from the terminal.",
    },
    {
      port: "Gothenburg (demo call)",
      inDays: 16,
      days: 1,
      arrive: "07:00",
      depart: "20:00",
      engineStopHours: null,
      workday: ["07:00", "19:00"],
      remarks: "",
    },
  ],
  HR: [
    {
      port: "Balboa anchorage (demo call)",
      inDays: 6,
      days: 2,
      arrive: "10:00",
      depart: "16:00",
      engineStopHours: 12,
      workday: ["07:00", "19:00"],
      remarks: "Waiting for the canal slot.",
    },
  ],
  SM: [
    {
      port: "Lyttelton (demo call)",
      inDays: 5,
      days: 2,
      arrive: "06:30",
      depart: "18:00",
      engineStopHours: 20,
      workday: ["07:00", "19:00"],
      remarks: "",
    },
  ],
};

/** The engine department on board for maintenance in port (invented crew, demo only). */
const DEMO_CREW: s.CrewOnBoard[] = [
  { rank: "chief-engineer", count: 1 },
  { rank: "second-engineer", count: 1 },
  { rank: "third-engineer", count: 1 },
  { rank: "fourth-engineer", count: 1 },
  { rank: "electro-technical-officer", count: 1 },
  { rank: "motorman", count: 2 },
  { rank: "oiler", count: 1 },
];

export async function seedPortStays(tx: Tx, companyId: string, vesselId: string, v: DemoVessel, now: Date) {
  const today = new TZDate(now, v.timeZone);
  const minutes = (clock: string) => Number(clock.slice(0, 2)) * 60 + Number(clock.slice(3));
  const rows = (STAYS[v.code] ?? []).map((stay) => {
    const arrivesAt = instantOfShipTime(format(addDays(today, stay.inDays), "yyyy-MM-dd"), stay.arrive, v.timeZone);
    const departsAt = instantOfShipTime(format(addDays(today, stay.inDays + stay.days - 1), "yyyy-MM-dd"), stay.depart, v.timeZone);
    const stopTo = stay.engineStopHours === null ? null : new Date(arrivesAt.getTime() + stay.engineStopHours * 3_600_000);
    return {
      companyId,
      vesselId,
      port: stay.port,
      arrivesAt,
      departsAt,
      workdayFrom: minutes(stay.workday[0]),
      workdayTo: minutes(stay.workday[1]),
      engineStopFrom: stopTo ? arrivesAt : null,
      engineStopTo: stopTo && stopTo < departsAt ? stopTo : stopTo ? departsAt : null,
      crew: DEMO_CREW,
      remarks: stay.remarks,
    };
  });
  if (rows.length) await tx.insert(s.portStay).values(rows);
}
