// Roles and what each may do. Pure: used by the access door and by the UI to hide controls.

export const ROLES = ["admin", "superintendent", "chief-engineer", "engineer", "viewer"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABEL: Record<Role, string> = {
  admin: "Company administrator",
  superintendent: "Technical superintendent",
  "chief-engineer": "Chief engineer",
  engineer: "Engineer",
  viewer: "Viewer",
};

export type Permission =
  | "vessel:read"
  | "readings:write"
  | "register:edit"
  | "company:manage"
  | "work:approve"
  | "work:plan"
  | "deferral:decide"
  | "fleet:read"
  | "parts:edit"
  | "stores:write"
  | "requisitions:order"
  | "clock:set";

const GRANTS: Record<Permission, readonly Role[]> = {
  "vessel:read": ROLES,
  "readings:write": ["engineer", "chief-engineer"],
  "register:edit": ["chief-engineer", "admin"],
  "company:manage": ["admin"],
  "work:approve": ["chief-engineer"],
  /** Port stays, work packages, planned dates, deferral requests. */
  "work:plan": ["chief-engineer"],
  /** Which deferrals each may decide is narrower: server/deferrals (critical and class → office). */
  "deferral:decide": ["superintendent", "chief-engineer"],
  /** The Fleet board: the office's view of every vessel. */
  "fleet:read": ["admin", "superintendent"],
  /** The company's parts catalogue: the office, and the chief engineer who finds a part on board. */
  "parts:edit": ["admin", "superintendent", "chief-engineer"],
  /** Stock on board: received, used, counted, moved between locations. */
  "stores:write": ["chief-engineer", "engineer"],
  /** The office's side of a requisition: ordering what the vessel sent (drafting and sending is work:plan). */
  "requisitions:order": ["admin", "superintendent"],
  /** The ship's clock changes on passage: the chief engineer on board (and the administrator). */
  "clock:set": ["chief-engineer", "admin"],
};

export function can(role: Role, permission: Permission): boolean {
  return GRANTS[permission].includes(role);
}

/** Office roles see every vessel of the company; seagoing roles and viewers see their assignments. */
export function seesWholeFleet(role: Role): boolean {
  return role === "admin" || role === "superintendent";
}
