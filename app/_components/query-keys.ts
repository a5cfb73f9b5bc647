// Every TanStack Query key in one place, so a mutation knows what to invalidate.
export const queryKeys = {
  hourLog: (vesselId: string) => ["vessel", vesselId, "hour-log"] as const,
  readingHistory: (vesselId: string, counterId: string, days: number) =>
    ["vessel", vesselId, "readings", counterId, days] as const,
  readings: (vesselId: string) => ["vessel", vesselId, "readings"] as const,
  register: (vesselId: string) => ["vessel", vesselId, "register"] as const,
  backlog: (vesselId: string, search: string) => ["vessel", vesselId, "backlog", search] as const,
  workOrder: (vesselId: string, workOrderId: string) => ["vessel", vesselId, "work-order", workOrderId] as const,
  routines: (vesselId: string) => ["vessel", vesselId, "routines"] as const,
  routineList: (vesselId: string, component: string, q: string) =>
    ["vessel", vesselId, "routines", "list", component, q] as const,
  routine: (vesselId: string, routineId: string) => ["vessel", vesselId, "routines", "one", routineId] as const,
  routineCopyTargets: (vesselId: string, routineId: string) =>
    ["vessel", vesselId, "routines", "copy-targets", routineId] as const,
  backlogAll: (vesselId: string) => ["vessel", vesselId, "backlog"] as const,
  adminVessels: () => ["admin", "vessels"] as const,
  adminPeople: () => ["admin", "people"] as const,
  adminToleranceRules: () => ["admin", "tolerance-rules"] as const,
};
