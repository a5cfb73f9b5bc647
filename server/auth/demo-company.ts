// The demo company: the seed creates it (db/seed/scenario.ts takes its slug from here), and with
// KEELSON_DEMO=1 the sign-in page lists its people (server/auth/demo.ts).
export const DEMO_COMPANY_SLUG = "brightwater";
