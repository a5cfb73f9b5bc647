// The fleet's requisitions as CSV for the office's purchasing: a row per part asked for.
import "server-only";
import type { Access } from "@/server/auth/access";
import { type CsvColumn, toCsv } from "@/server/export/csv";
import type { RequisitionLineView, RequisitionView } from "./contract";
import { STATE_WORDS } from "./requisition-rules";
import { fleetRequisitions } from "./requisitions";
import { shipDay } from "@/server/format/hours";

type Row = { r: RequisitionView; l: RequisitionLineView };
const day = (iso: string | null) => (iso ? iso.slice(0, 10) : "");

const COLUMNS: CsvColumn<Row>[] = [
  { header: "Vessel", value: ({ r }) => r.vessel.name },
  { header: "Requisition", value: ({ r }) => r.number },
  { header: "State", value: ({ r }) => STATE_WORDS[r.state] },
  { header: "Deliver at", value: ({ r }) => (r.portStay ? `${r.portStay.port} (arrives ${shipDay(new Date(r.portStay.arrivesAt), r.vessel.timeZone)}, ship’s day)` : "") },
  { header: "Part number", value: ({ l }) => l.number },
  { header: "Description", value: ({ l }) => l.description },
  { header: "Unit", value: ({ l }) => l.unit },
  { header: "Asked", value: ({ l }) => l.quantity },
  { header: "Received", value: ({ l }) => l.received },
  { header: "Why", value: ({ l }) => l.reason },
  { header: "Order reference", value: ({ r }) => r.orderRef },
  { header: "Drafted (UTC)", value: ({ r }) => day(r.createdAt) },
  { header: "Sent (UTC)", value: ({ r }) => day(r.sentAt) },
  { header: "Ordered (UTC)", value: ({ r }) => day(r.orderedAt) },
  { header: "Delivered (UTC)", value: ({ r }) => day(r.deliveredAt) },
  { header: "Note", value: ({ r }) => r.note },
];

export async function fleetRequisitionsCsv(access: Access, state: "open" | "all"): Promise<string> {
  const rows = (await fleetRequisitions(access, state)).flatMap((r) => r.lines.map((l) => ({ r, l })));
  return toCsv(COLUMNS, rows);
}
