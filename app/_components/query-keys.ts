// Every TanStack Query key in one place, so a mutation knows what to invalidate.
export const queryKeys = {
  hourLog: (vesselId: string) => ["vessel", vesselId, "hour-log"] as const,
  shipClock: (vesselId: string) => ["vessel", vesselId, "ship-clock"] as const,
  readingHistory: (vesselId: string, counterId: string, days: number) =>
    ["vessel", vesselId, "readings", counterId, days] as const,
  readings: (vesselId: string) => ["vessel", vesselId, "readings"] as const,
  register: (vesselId: string) => ["vessel", vesselId, "register"] as const,
  backlog: (vesselId: string, search: string) => ["vessel", vesselId, "backlog", search] as const,
  workOrder: (vesselId: string, workOrderId: string) => ["vessel", vesselId, "work-order", workOrderId] as const,
  trail: (vesselId: string, table: string, record: string) => ["vessel", vesselId, "trail", table, record] as const,
  /** Under the work order's key, so an approval that adds a value refreshes the trends too. */
  workOrderTrends: (vesselId: string, workOrderId: string, routineId: string) =>
    ["vessel", vesselId, "work-order", workOrderId, "trends", routineId] as const,
  /** Under the work order's key, so whatever refreshes the work order refreshes its files too. */
  workOrderAttachments: (vesselId: string, workOrderId: string) =>
    ["vessel", vesselId, "work-order", workOrderId, "attachments"] as const,
  routines: (vesselId: string) => ["vessel", vesselId, "routines"] as const,
  routineList: (vesselId: string, component: string, q: string) =>
    ["vessel", vesselId, "routines", "list", component, q] as const,
  routine: (vesselId: string, routineId: string) => ["vessel", vesselId, "routines", "one", routineId] as const,
  routineCopyTargets: (vesselId: string, routineId: string) =>
    ["vessel", vesselId, "routines", "copy-targets", routineId] as const,
  backlogAll: (vesselId: string) => ["vessel", vesselId, "backlog"] as const,
  calendar: (vesselId: string, start: string, end: string) => ["vessel", vesselId, "calendar", start, end] as const,
  calendarAll: (vesselId: string) => ["vessel", vesselId, "calendar"] as const,
  portStays: (vesselId: string) => ["vessel", vesselId, "port-stays"] as const,
  stores: (vesselId: string) => ["vessel", vesselId, "stores"] as const,
  parts: () => ["parts"] as const,
  requisitions: (vesselId: string) => ["vessel", vesselId, "requisitions"] as const,
  stayParts: (vesselId: string, stayId: string, jobs: string, minimum: boolean) => ["vessel", vesselId, "requisitions", "stay", stayId, jobs, minimum] as const,
  fleetRequisitions: (state: string) => ["fleet-requisitions", state] as const,
  portStay: (vesselId: string, stayId: string) => ["vessel", vesselId, "port-stays", stayId] as const,
  deferrals: (vesselId: string) => ["vessel", vesselId, "deferrals"] as const,
  adminVessels: () => ["admin", "vessels"] as const,
  adminPeople: () => ["admin", "people"] as const,
  adminToleranceRules: () => ["admin", "tolerance-rules"] as const,
  adminMail: () => ["admin", "mail"] as const,
  fleetBoard: () => ["fleet", "board"] as const,
  fleetOverdue: (search: string) => ["fleet", "overdue", search] as const,
};
