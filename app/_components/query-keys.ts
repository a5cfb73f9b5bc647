// Every TanStack Query key in one place, so a mutation knows what to invalidate.
export const queryKeys = {
  hourLog: (vesselId: string) => ["vessel", vesselId, "hour-log"] as const,
  readingHistory: (vesselId: string, counterId: string, days: number) =>
    ["vessel", vesselId, "readings", counterId, days] as const,
  readings: (vesselId: string) => ["vessel", vesselId, "readings"] as const,
  register: (vesselId: string) => ["vessel", vesselId, "register"] as const,
  backlog: (vesselId: string, search: string) => ["vessel", vesselId, "backlog", search] as const,
  adminVessels: () => ["admin", "vessels"] as const,
  adminPeople: () => ["admin", "people"] as const,
};
