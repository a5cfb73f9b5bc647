import { numeric } from "drizzle-orm/pg-core";

/** Hours are kept as numeric(12,1) — tenths of an hour, never a float column. */
export const hours = () => numeric({ precision: 12, scale: 1, mode: "number" });

/** People of one rank: a routine's team (rank × head count) or the crew of a port stay. */
export type HeadCount = { rank: string; count: number };
