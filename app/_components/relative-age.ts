import { formatDistanceStrict } from "date-fns";

/** "3 hours ago", "2 days ago": how old a reading is, for people, not for the computation. */
export function ageOf(instant: Date | string, now: Date | string): string {
  return `${formatDistanceStrict(new Date(instant), new Date(now))} ago`;
}
