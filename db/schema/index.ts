export * from "./auth";
export * from "./machinery";
export * from "./readings";
export * from "./tenancy";
export * from "./maintenance";
export * from "./mail";
export * from "./fleet";
export * from "./plan-problems";
