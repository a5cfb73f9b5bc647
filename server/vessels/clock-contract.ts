import { z } from "zod";
import { enteredDay } from "@/server/http/dates";
import { ShipClock } from "@/server/readings/contract";
import { zoneFromInput } from "./clock-rules";

/** A change of the ship's clock: from when (ship's day and time as the clock shows before it), to which zone. */
export const ClockChangeInput = z.object({
  shipDay: enteredDay("planned", "The day of the change", "shipDay: pick the ship's day of the change (YYYY-MM-DD)."),
  time: ShipClock,
  zone: z
    .string({ message: "zone: pick the zone the ship keeps from then on." })
    .max(64, { message: "zone: a zone such as UTC+7 or Asia/Singapore." })
    .transform((text, ctx) => {
      const zone = zoneFromInput(text);
      if (!zone) {
        ctx.addIssue({ code: "custom", message: `zone: “${text.slice(0, 40)}” is not a zone: pick an offset such as UTC+7, or a name such as Asia/Singapore.` });
        return z.NEVER;
      }
      return zone;
    }),
  note: z
    .string({ message: "The note must be text." })
    .trim()
    .max(300, { message: "Keep the note to 300 characters or fewer." })
    .default(""),
});
export type ClockChangeValues = z.output<typeof ClockChangeInput>;

export type ClockChangeItem = {
  id: string;
  effectiveAt: string;
  /** The ship's time of the change, on the clock kept before it: "6 Dec 2026 00:00". */
  effectiveWords: string;
  fromZone: string;
  toZone: string;
  move: string;
  note: string;
  by: string | null;
  inForce: boolean;
};

export type ShipClockView = {
  zone: string;
  zoneWords: string;
  canSet: boolean;
  changes: ClockChangeItem[];
};
