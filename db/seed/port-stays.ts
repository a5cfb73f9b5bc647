// Demo port stays: for each vessel, the next two invented port calls with the crew's maintenance
// hours, so the chief engineer has a stay to plan. Ports, dates and figures are made up.
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
  engineMayStop: boolean;
  immobilisationHours: number;
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
      engineMayStop: true,
      immobilisationHours: 24,
      remarks: "Discharge at the container terminal; main engine may be immobilised with the harbour master's consent.",
    },
    {
      port: "Laem Chabang (demo call)",
      inDays: 19,
      days: 1,
      arrive: "06:00",
      depart: "22:00",
      engineMayStop: false,
      immobilisationHours: 0,
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
      engineMayStop: true,
      immobilisationHours: 36,
      remarks: "Berth 4; immobilisation permit requested from the terminal.",
    },
    {
      port: "Gothenburg (demo call)",
      inDays: 16,
      days: 1,
      arrive: "07:00",
      depart: "20:00",
      engineMayStop: false,
      immobilisationHours: 0,
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
      engineMayStop: true,
      immobilisationHours: 12,
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
      engineMayStop: true,
      immobilisationHours: 20,
      remarks: "",
    },
  ],
};

/** Man-hours each rank has for planned maintenance on a port day (invented crew, demo only). */
const DEMO_CREW: s.CrewCapacity[] = [
  { rank: "chief-engineer", manHoursPerDay: 2 },
  { rank: "second-engineer", manHoursPerDay: 8 },
  { rank: "third-engineer", manHoursPerDay: 8 },
  { rank: "fourth-engineer", manHoursPerDay: 6 },
  { rank: "motorman", manHoursPerDay: 12 },
  { rank: "electrician", manHoursPerDay: 6 },
];

export async function seedPortStays(tx: Tx, companyId: string, vesselId: string, v: DemoVessel, now: Date) {
  const today = new TZDate(now, v.timeZone);
  const rows = (STAYS[v.code] ?? []).map((stay) => ({
    companyId,
    vesselId,
    port: stay.port,
    arrivesAt: instantOfShipTime(format(addDays(today, stay.inDays), "yyyy-MM-dd"), stay.arrive, v.timeZone),
    departsAt: instantOfShipTime(
      format(addDays(today, stay.inDays + stay.days - 1), "yyyy-MM-dd"),
      stay.depart,
      v.timeZone,
    ),
    engineMayStop: stay.engineMayStop,
    immobilisationHours: stay.immobilisationHours,
    crew: DEMO_CREW,
    remarks: stay.remarks,
  }));
  if (rows.length) await tx.insert(s.portStay).values(rows);
}
