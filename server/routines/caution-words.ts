// Keelson's own wording of the usual precautions, shown on the work order page, the package sheet
// and the printed job card; the ship's safety management system has the procedure. Plain values.
import type { RoutineCaution } from "@/db/schema";

export const CAUTION_WORDS: Record<RoutineCaution, { title: string; text: string }> = {
  isolation: {
    title: "Isolate and lock out",
    text: "Stop the machinery, isolate its power, fuel, oil, steam and air, lock and tag every isolation, and prove it dead before opening anything.",
  },
  "permit-to-work": {
    title: "Permit to work",
    text: "Get the permit issued and signed by the responsible officer before starting; close it out when the job is boxed up.",
  },
  "enclosed-space": {
    title: "Enclosed space",
    text: "Ventilate, test the atmosphere, post a standby at the entrance and keep to the entry permit before anyone goes in.",
  },
  "hot-work": {
    title: "Hot work",
    text: "Hot-work permit, combustibles cleared, fire watch posted and an extinguisher at hand, during the work and after it.",
  },
  "starting-air": {
    title: "Starting air",
    text: "Shut the main starting valve and the starting-air supply, vent the line, and block and tag the valves against opening.",
  },
  "turning-gear": {
    title: "Turning gear",
    text: "Engage the turning gear and post a warning at every control stand so nobody can start or turn the engine while people work inside it.",
  },
};

/** Said where no particular caution is listed for a job. */
export const NO_PARTICULAR_CAUTION = "No particular precautions are listed for this job; keep to the ship’s usual safe practice.";

/** What Keelson is not: said under every set of cautions. */
export const CAUTIONS_DEFER =
  "Keelson plans and records; the maker’s instruction manual, local regulations and class requirements prevail.";
