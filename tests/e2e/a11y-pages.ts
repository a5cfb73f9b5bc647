// Every page of the app for the accessibility test: the page files are read from app/ at test time,
// and each route says who opens it and where its ids come from. A page added tomorrow has no entry
// here and fails the test until someone lists it.
import { readdirSync } from "node:fs";
import path from "node:path";
import { and, asc, eq } from "drizzle-orm";
import * as s from "@/db/schema";
import { DEMO_COMPANY_SLUG } from "@/server/auth/demo-company";
import type { Db } from "@/db/client";

/** Demo people (db/seed/scenario.ts); "anonymous" opens the pages before sign-in. */
export type Visitor =
  "anonymous" | "chief@brightwater.example" | "super@brightwater.example" | "admin@brightwater.example";

export type DemoIds = { vesselId: string; workOrderId: string; stayId: string };

type PageEntry = {
  as: Visitor;
  path: (ids: DemoIds) => string;
  /** A widget drawn only once the page's data is in (else the page's first heading). */
  ready?: string;
};

const CHIEF = "chief@brightwater.example";
const at = (as: Visitor, url: string): PageEntry => ({ as, path: () => url });
/** A page of the demo vessel, opened by its chief engineer. */
const onVessel = (below: (ids: DemoIds) => string, ready?: string): PageEntry => ({
  as: CHIEF,
  path: (ids) => `/vessels/${ids.vesselId}${below(ids)}`,
  ready,
});
const section = (name: string, ready?: string) => onVessel(() => `/${name}`, ready);
const office = (url: string) => at("super@brightwater.example", url);
const admin = (url: string) => at("admin@brightwater.example", url);

/** Route (as the page file's folder, route groups left out) → how to open it. */
export const PAGES: Record<string, PageEntry> = {
  "/sign-in": at("anonymous", "/sign-in"),
  "/forgot-password": at("anonymous", "/forgot-password"),
  // Without a token: the "link has expired" view (a valid token would be spent by the visit).
  "/set-password": at("anonymous", "/set-password"),
  // Without a signed link: the "link does not work" view, the only one reachable without mail.
  "/unsubscribe": at("anonymous", "/unsubscribe"),
  "/": at(CHIEF, "/"),
  "/account": at(CHIEF, "/account"),
  "/vessels/[vesselId]/hour-log": section("hour-log"),
  "/vessels/[vesselId]/backlog": section("backlog", "tbody tr"),
  "/vessels/[vesselId]/calendar": section("calendar", ".fc-daygrid"),
  "/vessels/[vesselId]/routines": section("routines"),
  "/vessels/[vesselId]/register": section("register"),
  "/vessels/[vesselId]/register/import": section("register/import"),
  "/vessels/[vesselId]/class-items": section("class-items", "tbody tr"),
  "/vessels/[vesselId]/port-stays": section("port-stays"),
  "/vessels/[vesselId]/stores": section("stores", "tbody tr"),
  "/parts": at(CHIEF, "/parts"),
  "/vessels/[vesselId]/requisitions": section("requisitions", "[data-requisition]"),
  "/vessels/[vesselId]/defects": section("defects", "[data-defect]"),
  "/requisitions": office("/requisitions"),
  "/vessels/[vesselId]/port-stays/[stayId]": onVessel((ids) => `/port-stays/${ids.stayId}`),
  "/vessels/[vesselId]/port-stays/[stayId]/sheet": onVessel((ids) => `/port-stays/${ids.stayId}/sheet`),
  "/vessels/[vesselId]/work-orders/[workOrderId]": onVessel((ids) => `/work-orders/${ids.workOrderId}`),
  "/fleet": office("/fleet"),
  "/fleet/overdue": office("/fleet/overdue"),
  "/fleet/class-items": office("/fleet/class-items"),
  "/admin": admin("/admin"),
  "/admin/people": admin("/admin/people"),
  "/admin/vessels": admin("/admin/vessels"),
  "/admin/tolerance-rules": admin("/admin/tolerance-rules"),
  "/admin/settings": admin("/admin/settings"),
  "/admin/mail": admin("/admin/mail"),
  "/admin/audit": admin("/admin/audit"),
};

/** Every page route of app/, from its `page.tsx` files: `(group)` folders are not in the URL. */
export function pageRoutesInApp(appDir = path.resolve("app")): string[] {
  return readdirSync(appDir, { recursive: true, encoding: "utf8" })
    .filter((file) => path.basename(file) === "page.tsx")
    .map((file) => {
      const segments = path
        .dirname(file)
        .split(path.sep)
        .filter((segment) => segment !== "." && !/^\(.+\)$/.test(segment));
      return `/${segments.join("/")}`;
    })
    .sort();
}

/** The demo vessel AG (the chief engineer's), its first work order and its first port stay. */
export async function demoIds(db: Db): Promise<DemoIds> {
  const [row] = await db
    .select({ vesselId: s.vessel.id, workOrderId: s.workOrder.id, stayId: s.portStay.id })
    .from(s.vessel)
    .innerJoin(s.company, eq(s.company.id, s.vessel.companyId))
    .innerJoin(s.workOrder, eq(s.workOrder.vesselId, s.vessel.id))
    .innerJoin(s.portStay, eq(s.portStay.vesselId, s.vessel.id))
    .where(and(eq(s.company.slug, DEMO_COMPANY_SLUG), eq(s.vessel.code, "AG")))
    .orderBy(asc(s.workOrder.number), asc(s.portStay.arrivesAt))
    .limit(1);
  if (!row) throw new Error("The demo vessel AG with a work order and a port stay is missing: is the demo seeded?");
  return row;
}
