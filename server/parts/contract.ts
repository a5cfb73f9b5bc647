// What the parts catalogue and the stores on board send and get back, shared by the forms and the
// route handlers. Quantities: whole pieces and sets; litres, kilograms and metres to three decimals.
import { z } from "zod";
import { PART_UNITS, type PartUnit, STOCK_MOVES, type StockMove } from "@/db/schema/parts";

export const UNIT_LABEL: Record<PartUnit, string> = { piece: "pcs", set: "sets", litre: "l", kg: "kg", metre: "m" };
/** A quantity in its unit, as people say it: "1 set", "3 sets", "1 pc", "2 pcs", "20.5 l". */
export function amountText(quantity: number, unit: PartUnit): string {
  const one = quantity === 1 ? ({ set: "set", piece: "pc" } as Partial<Record<PartUnit, string>>)[unit] : undefined;
  return `${quantity} ${one ?? UNIT_LABEL[unit]}`;
}
/** Units counted whole: a bolt or a gasket set is never 0.5. */
export const WHOLE_UNITS: readonly PartUnit[] = ["piece", "set"];

const text = (what: string, max: number) =>
  z
    .string({ message: `${what}: enter text.` })
    .trim()
    .max(max, { message: `${what}: keep it to ${max} characters.` });

/** A quantity as typed: "12", "2.5", "2,5". */
export const Quantity = z
  .union([z.number(), z.string()], { message: "Enter a quantity, e.g. 4 or 2.5." })
  .transform((raw, ctx) => {
    const n = typeof raw === "number" ? raw : Number(raw.trim().replace(",", "."));
    if (!Number.isFinite(n) || (typeof raw === "string" && !/^\d+([.,]\d{1,3})?$/.test(raw.trim()))) {
      ctx.addIssue({ code: "custom", message: "Enter a quantity, e.g. 4 or 2.5 (at most three decimals)." });
      return z.NEVER;
    }
    if (n <= 0 || n > 1_000_000) {
      ctx.addIssue({ code: "custom", message: "The quantity is more than 0 and at most 1,000,000." });
      return z.NEVER;
    }
    return Math.round(n * 1000) / 1000;
  });

const Minimum = z
  .union([z.number(), z.string()], { message: "Enter the least to keep on board, e.g. 2 (0 for none)." })
  .transform((raw, ctx) => {
    const n = typeof raw === "number" ? raw : raw.trim() === "" ? 0 : Number(raw.trim().replace(",", "."));
    if (!Number.isFinite(n) || n < 0 || n > 1_000_000) {
      ctx.addIssue({ code: "custom", message: "Minimum on board: enter 0 or more (at most 1,000,000)." });
      return z.NEVER;
    }
    return Math.round(n * 1000) / 1000;
  });

export const PartNumber = z
  .string({ message: "Enter the company’s part number, e.g. KP-10432." })
  .trim()
  .regex(/^[A-Za-z0-9][A-Za-z0-9._/-]{0,39}$/, {
    message: "The part number holds letters, digits and . _ / - (at most 40), e.g. KP-10432.",
  });

const partFields = {
  number: PartNumber,
  makerRef: text("Maker’s reference", 80),
  description: text("Description", 200).min(2, { message: "Describe the part, e.g. “Piston ring set, cylinder unit”." }),
  unit: z.enum(PART_UNITS, { message: `Unit: one of ${PART_UNITS.join(", ")}.` }),
  critical: z.boolean({ message: "Critical spare: true or false." }),
  minimumOnBoard: Minimum,
  /** The components it fits, on any of the company's vessels. */
  fits: z
    .array(z.uuid({ message: "Choose the components from the list." }), { message: "Choose the components from the list." })
    .max(200, { message: "A part fits at most 200 components here." }),
};

export const PartInput = z.object({
  ...partFields,
  makerRef: partFields.makerRef.default(""),
  unit: partFields.unit.default("piece"),
  critical: partFields.critical.default(false),
  minimumOnBoard: partFields.minimumOnBoard.default(0),
  fits: partFields.fits.default([]),
});
export type PartInput = z.input<typeof PartInput>;
export type PartValues = z.output<typeof PartInput>;
/** A change: only the fields sent (no defaults, or a change of the minimum would reset the unit). */
export const PartPatch = z.object(partFields).partial();

export const LocationInput = z.object({
  store: text("Store", 60).min(1, { message: "Name the store, e.g. Engine store." }),
  rack: text("Rack", 30).default(""),
  bin: text("Bin", 30).default(""),
});
export type LocationInput = z.input<typeof LocationInput>;

const Reason = text("Reason", 300);

/** What was found on the shelf when counted, 0 or more. */
const Counted = z
  .union([z.number(), z.string()], { message: "Enter what you counted, 0 or more." })
  .transform((raw, ctx) => {
    const n = typeof raw === "number" ? raw : Number(raw.trim().replace(",", "."));
    if (!Number.isFinite(n) || n < 0 || n > 1_000_000 || (typeof raw === "string" && raw.trim() === "")) {
      ctx.addIssue({ code: "custom", message: "Enter what you counted, 0 or more." });
      return z.NEVER;
    }
    return Math.round(n * 1000) / 1000;
  });

/** One movement of stock on board, as the storekeeper or the engineer records it. */
export const MovementInput = z.discriminatedUnion(
  "kind",
  [
    z.object({ kind: z.literal("received"), partId: z.uuid({ message: "Choose the part." }), locationId: z.uuid({ message: "Choose where it is kept." }), quantity: Quantity, reason: Reason.default("") }),
    z.object({
      kind: z.literal("counted"),
      partId: z.uuid({ message: "Choose the part." }),
      locationId: z.uuid({ message: "Choose where it is kept." }),
      /** What was found on the shelf: the movement is the difference. */
      counted: Counted,
      reason: Reason.min(3, { message: "Say why the count differs, e.g. “found two in the wrong bin”." }),
    }),
    z.object({
      kind: z.literal("moved"),
      partId: z.uuid({ message: "Choose the part." }),
      locationId: z.uuid({ message: "Choose where it is taken from." }),
      toLocationId: z.uuid({ message: "Choose where it goes." }),
      quantity: Quantity,
      reason: Reason.default(""),
    }),
  ],
  { message: "kind: one of received, counted, moved." },
);
export type MovementInput = z.input<typeof MovementInput>;
export type MovementValues = z.output<typeof MovementInput>;

export type CataloguePart = {
  id: string;
  number: string;
  makerRef: string;
  description: string;
  unit: PartUnit;
  critical: boolean;
  minimumOnBoard: number;
  fits: { id: string; code: string; name: string; vesselCode: string }[];
};
export type Catalogue = { parts: CataloguePart[]; canEdit: boolean };

export type StockLine = {
  part: Pick<CataloguePart, "id" | "number" | "description" | "unit" | "critical" | "minimumOnBoard" | "makerRef">;
  onBoard: number;
  byLocation: { locationId: string; place: string; quantity: number }[];
  /** Under the minimum the company set for it. */
  low: boolean;
};
export type StoresView = {
  vessel: { id: string; name: string; code: string };
  locations: { id: string; place: string }[];
  lines: StockLine[];
  canWrite: boolean;
};
/** A part that fits a work order's component (or one above it), with what the vessel holds. */
export type FittingPart = {
  id: string;
  number: string;
  description: string;
  unit: PartUnit;
  critical: boolean;
  minimumOnBoard: number;
  onBoard: number;
  low: boolean;
  /** The component it is listed for; empty for a part the routine names that is listed for none. */
  fits: string;
  /** What the routine needs each time; null for a part that only fits. */
  needed: number | null;
  /** Needed but not on board. */
  short: number;
};
export type RecentMovement = { kind: StockMove; quantity: number; place: string; reason: string; by: string | null; at: string };
export { STOCK_MOVES };

/** The parts a routine needs each time, chosen from the catalogue: the whole list, as saved. */
export const RoutinePartsInput = z.object({
  parts: z
    .array(z.object({ partId: z.uuid({ message: "Choose the part from the catalogue." }), quantity: Quantity }), { message: "parts: a list of { partId, quantity }." })
    .max(100, { message: "A routine needs at most 100 different parts." }),
});
export type RoutinePartsInput = z.input<typeof RoutinePartsInput>;

/**
 * A part used on a job, as the completion form records it. Using more than the stores record asks
 * for a count: what was on board before the job, and why the record differs.
 */
export const PartUsedRow = z
  .object({
    partId: z.uuid({ message: "Choose the part used." }),
    quantity: Quantity,
    counted: z.union([z.literal("").transform(() => null), Counted]).nullish(),
    reason: Reason.default(""),
  })
  .superRefine((row, ctx) => {
    if (row.counted != null && row.reason.length < 3) {
      ctx.addIssue({ code: "custom", path: ["reason"], message: "Say why the count differs from the record, e.g. “two found in the workshop”." });
    }
  });
export type PartUsedRow = z.output<typeof PartUsedRow>;
export const MAX_PARTS_USED = 50;

// Requisitions: parts asked of the office for delivery at a port stay.
const StayChoice = z.union([z.literal("").transform(() => null), z.uuid({ message: "Choose the port stay from the list." })], {
  message: "Choose the port stay from the list.",
});
export const MAX_REQUISITION_LINES = 200;
const requisitionFields = {
  portStayId: StayChoice.nullable(),
  note: text("Note", 2_000),
  lines: z
    .array(
      z.object({
        partId: z.uuid({ message: "Choose the part from the catalogue." }),
        quantity: Quantity,
        reason: text("Reason", 300).default(""),
      }),
      { message: "lines: a list of { partId, quantity, reason }." },
    )
    .min(1, { message: "Ask for at least one part." })
    .max(MAX_REQUISITION_LINES, { message: `At most ${MAX_REQUISITION_LINES} parts on one requisition.` }),
};
export const RequisitionInput = z.object({ ...requisitionFields, portStayId: requisitionFields.portStayId.default(null), note: requisitionFields.note.default("") });
export type RequisitionInput = z.input<typeof RequisitionInput>;
export type RequisitionValues = z.output<typeof RequisitionInput>;
/** A draft changed: only the fields sent. */
export const RequisitionPatch = z.object(requisitionFields).partial();

export const RequisitionMoveInput = z.object({
  to: z.enum(["sent", "ordered", "cancelled"], { message: "to: one of sent, ordered, cancelled." }),
  /** The office's purchase order, when ordering. */
  orderRef: text("Order reference", 60).default(""),
});

export const ReceiptInput = z.object({
  items: z
    .array(
      z.object({
        lineId: z.uuid({ message: "Choose the line received." }),
        locationId: z.uuid({ message: "Choose where it is kept." }),
        quantity: Quantity,
      }),
      { message: "items: a list of { lineId, locationId, quantity }." },
    )
    .max(MAX_REQUISITION_LINES, { message: `At most ${MAX_REQUISITION_LINES} items at once.` })
    .default([]),
  /** Close it as delivered with what came, though some lines are short. */
  complete: z.boolean({ message: "complete: true or false." }).default(false),
});
export type ReceiptInput = z.input<typeof ReceiptInput>;

export const FleetRequisitionsQuery = z.object({
  state: z.enum(["open", "all"], { message: "state: open or all." }).default("open"),
});
export const StayPartsQuery = z.object({
  /** Bring every part back to its minimum too. */
  minimum: z.enum(["0", "1"], { message: "minimum: 0 or 1." }).default("1"),
  /** The work orders on the timeline shown (a proposal not yet accepted), comma-separated; else the accepted package. */
  jobs: z
    .string()
    .max(500 * 37, { message: "jobs: at most 500 work orders." })
    .transform((raw, ctx) => {
      const ids = raw.split(",").map((s) => s.trim()).filter(Boolean);
      if (ids.length > 500 || ids.some((id) => !z.uuid().safeParse(id).success)) {
        ctx.addIssue({ code: "custom", message: "jobs: work order ids, comma-separated (at most 500)." });
        return z.NEVER;
      }
      return ids;
    })
    .optional(),
});

export type RequisitionLineView = {
  id: string;
  partId: string;
  number: string;
  description: string;
  unit: PartUnit;
  quantity: number;
  received: number;
  reason: string;
};
export type RequisitionView = {
  id: string;
  number: string;
  state: import("@/db/schema/parts").RequisitionState;
  vessel: { id: string; name: string; code: string; timeZone: string };
  portStay: { id: string; port: string; arrivesAt: string } | null;
  note: string;
  orderRef: string;
  createdBy: string | null;
  createdAt: string;
  sentAt: string | null;
  orderedAt: string | null;
  deliveredAt: string | null;
  lines: RequisitionLineView[];
  may: { edit: boolean; send: boolean; order: boolean; cancel: boolean; receive: boolean };
};
export type RequisitionList = {
  vessel: { id: string; name: string; code: string; timeZone: string };
  requisitions: RequisitionView[];
  /** The vessel's port stays not yet over, to deliver at. */
  stays: { id: string; port: string; arrivesAt: string }[];
  locations: { id: string; place: string }[];
  canDraft: boolean;
};
export type StayPartLine = import("./requisition-rules").ShortLine & {
  number: string;
  description: string;
  unit: PartUnit;
  critical: boolean;
  minimumOnBoard: number;
};
export type StayParts = {
  stayId: string;
  /** Whose jobs were counted: the accepted package, or the jobs on the timeline shown. */
  basis: "accepted-package" | "shown";
  jobs: number;
  lines: StayPartLine[];
  openRequisitions: { id: string; number: string; state: string }[];
  canRequest: boolean;
};
