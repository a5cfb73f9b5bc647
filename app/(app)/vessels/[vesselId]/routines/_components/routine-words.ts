// The words the routine form uses for cautions (ranks: app/_components/rank-words.ts).
import type { RoutineCaution } from "@/db/schema/maintenance";

/** The usual wording of each caution, as shown on the form and on the work order. */
export const CAUTION_WORDS: Record<RoutineCaution, string> = {
  isolation: "Isolation and lock-out before opening machinery",
  "permit-to-work": "Permit to work issued and signed before the job starts",
  "enclosed-space": "Enclosed-space entry: atmosphere tested, space ventilated, a standby person outside",
  "hot-work": "Hot work: permit, fire watch and combustibles cleared away",
  "starting-air": "Starting air shut off and the lines vented before work on the engine",
  "turning-gear": "Turning gear engaged and signposted before the engine is opened or turned",
};

export const CAUTIONS_PREVAIL = "The maker’s instruction manual, local regulations and class requirements prevail.";
