// Page weight: each page's first visit in Debian's chromium, in a new browser context (an empty
// cache), loaded until the network is idle; the bytes on the wire (compressed, headers included,
// as DevTools counts "transferred") summed by resource type from CDP's Network.loadingFinished.
// The pages show the demo company (seeded here: the bench stack runs with KEELSON_DEMO=0), a year
// of readings, routines, work orders and port stays, as a user of a real fleet would see them.
import { writeFileSync } from "node:fs";
import { and, asc, eq, gte } from "drizzle-orm";
import type { Browser } from "playwright-core";
import { closeDb, getDb } from "@/db/client";
import * as s from "@/db/schema";
import { seedDemo } from "@/db/seed";
import { DEMO_PASSWORD, demoCompany, demoUsers } from "@/db/seed/scenario";
import { launchBrowser } from "@/tests/support/browser";
import { BASE_URL, signIn } from "@/tests/support/http";

// The issue's budget: the Hour log is opened by every engineer every day, on a ship's connection.
const HOUR_LOG_BUDGET = 150_000;
const BUDGET = 250_000;

const KINDS = ["script", "style", "font", "document", "data", "image", "other"] as const;
type Kind = (typeof KINDS)[number];
/** `bytes` on the wire with headers; `body` without them, to judge compression (next start skips under 1 kB). */
type Resource = { url: string; kind: Kind; bytes: number; body: number; encoding: string | null };
type Weight = {
  page: string;
  path: string;
  budget: number;
  total: number;
  byKind: Record<Kind, number>;
  resources: Resource[];
};

function kindOf(cdpType: string | undefined): Kind {
  switch (cdpType) {
    case "Script":
      return "script";
    case "Stylesheet":
      return "style";
    case "Font":
      return "font";
    case "Document":
      return "document";
    case "Fetch":
    case "XHR":
      return "data";
    case "Image":
      return "image";
    default:
      return "other";
  }
}

async function weigh(browser: Browser, page: string, path: string, cookie: string | null): Promise<Weight> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  try {
    if (cookie) {
      await context.addCookies(
        cookie.split("; ").map((pair) => {
          const at = pair.indexOf("=");
          return { name: pair.slice(0, at), value: pair.slice(at + 1), url: BASE_URL };
        }),
      );
    }
    const tab = await context.newPage();
    const cdp = await context.newCDPSession(tab);
    const seen = new Map<string, { url: string; type: string | undefined; encoding: string | null; headers: number }>();
    const resources: Resource[] = [];
    cdp.on("Network.responseReceived", (e) => {
      const encoding =
        Object.entries(e.response.headers).find(([k]) => k.toLowerCase() === "content-encoding")?.[1] ?? null;
      seen.set(e.requestId, { url: e.response.url, type: e.type, encoding, headers: e.response.encodedDataLength });
    });
    cdp.on("Network.loadingFinished", (e) => {
      const r = seen.get(e.requestId);
      if (r) {
        const body = e.encodedDataLength - r.headers;
        resources.push({ url: r.url, kind: kindOf(r.type), bytes: e.encodedDataLength, body, encoding: r.encoding });
      }
    });
    await cdp.send("Network.enable");
    const response = await tab.goto(`${BASE_URL}${path}`, { waitUntil: "networkidle", timeout: 60_000 });
    const landed = new URL(tab.url()).pathname;
    if (response?.status() !== 200 || landed !== path)
      throw new Error(`${page}: ${path} answered ${response?.status()} at ${landed}`);
    const byKind = Object.fromEntries(KINDS.map((k) => [k, 0])) as Record<Kind, number>;
    for (const r of resources) byKind[r.kind] += r.bytes;
    const total = resources.reduce((sum, r) => sum + r.bytes, 0);
    return { page, path, budget: page === "Hour log" ? HOUR_LOG_BUDGET : BUDGET, total, byKind, resources };
  } finally {
    await context.close();
  }
}

const kb = (bytes: number) => (bytes / 1000).toFixed(1);

function markdown(weights: Weight[], at: Date): string {
  const row = (w: Weight) => {
    const over = w.total > w.budget ? ` **over ${kb(w.budget)}**` : "";
    const { script, style, font, data, document, image, other } = w.byKind;
    return `| ${w.page} | ${kb(w.total)}${over} | ${kb(script)} | ${kb(style)} | ${kb(font)} | ${kb(data)} | ${kb(document + image + other)} |`;
  };
  const hourLog = weights.find((w) => w.page === "Hour log");
  const largest = (hourLog?.resources ?? [])
    .filter((r) => r.kind === "script" || r.kind === "font")
    .sort((a, b) => b.bytes - a.bytes)
    .slice(0, 8)
    .map((r) => `| ${new URL(r.url).pathname} | ${r.kind} | ${kb(r.bytes)} |`);
  // Text sent without compression: next start gzips by default, so any hit here is a regression.
  const plain = weights.flatMap((w) =>
    w.resources
      .filter((r) => !r.encoding && r.body > 1024 && r.kind !== "font" && r.kind !== "image")
      .map((r) => `${w.page}: ${new URL(r.url).pathname} (${kb(r.body)} kB)`),
  );
  const encodings = [...new Set(weights.flatMap((w) => w.resources.map((r) => r.encoding ?? "none")))].join(", ");
  return [
    `First visit of each page, ${at.toISOString().slice(0, 16)} UTC: a new chromium context (empty cache), loaded until the network`,
    "is idle; kB (1,000 bytes) transferred on the wire, compressed, headers included. Data = fetch/XHR",
    "(route handlers' JSON and the router's RSC requests); other = the document, images and the rest.",
    `Budget: Hour log under ${kb(HOUR_LOG_BUDGET)} kB, every other page under ${kb(BUDGET)} kB.`,
    "",
    "| page | total kB | script | style | font | data | other |",
    "| --- | --- | --- | --- | --- | --- | --- |",
    ...weights.map(row),
    "",
    `Content-Encoding seen: ${encodings}. ${plain.length ? `Sent uncompressed: ${plain.join("; ")}.` : "Every text resource over 1 kB came compressed (next start leaves smaller ones plain)."}`,
    "",
    "Heaviest scripts and fonts of the Hour log:",
    "",
    "| resource | kind | kB |",
    "| --- | --- | --- |",
    ...largest,
  ].join("\n");
}

const now = new Date();
console.log(`[bench] seeding the demo company for page weight: ${await seedDemo(now)}`);
const db = getDb();
const [company] = await db.select().from(s.company).where(eq(s.company.slug, demoCompany.slug));
const [vessel] = await db
  .select()
  .from(s.vessel)
  .where(eq(s.vessel.companyId, company!.id))
  .orderBy(asc(s.vessel.code));
const vesselId = vessel!.id;
const [workOrder] = await db
  .select()
  .from(s.workOrder)
  .where(and(eq(s.workOrder.vesselId, vesselId), eq(s.workOrder.state, "late")))
  .orderBy(asc(s.workOrder.number))
  .limit(1);
const [stay] = await db
  .select()
  .from(s.portStay)
  .where(and(eq(s.portStay.vesselId, vesselId), gte(s.portStay.departsAt, now)))
  .orderBy(asc(s.portStay.arrivesAt))
  .limit(1);
if (!workOrder || !stay) throw new Error("the demo vessel has no late work order or no upcoming port stay");
await closeDb();

// The administrator opens every page, the company's too; the board shows the whole fleet.
const admin = demoUsers.find((u) => u.role === "admin")!;
const session = await signIn(admin.email, DEMO_PASSWORD);
const v = `/vessels/${vesselId}`;
const pages: [string, string, boolean][] = [
  ["Sign-in", "/sign-in", false],
  ["Vessels", "/", true],
  ["Hour log", `${v}/hour-log`, true],
  ["Backlog", `${v}/backlog`, true],
  ["Calendar", `${v}/calendar`, true],
  ["Routines", `${v}/routines`, true],
  ["Register", `${v}/register`, true],
  ["Work order", `${v}/work-orders/${workOrder.id}`, true],
  ["Port stays", `${v}/port-stays`, true],
  ["Port stay", `${v}/port-stays/${stay.id}`, true],
  ["Fleet board", "/fleet", true],
  ["Fleet overdue list", "/fleet/overdue", true],
  ["Company", "/admin", true],
  ["Company: people", "/admin/people", true],
  ["Company: vessels", "/admin/vessels", true],
  ["Company: tolerance rules", "/admin/tolerance-rules", true],
  ["Company: settings", "/admin/settings", true],
  ["Company: mail", "/admin/mail", true],
  ["My e-mail", "/account", true],
];

const browser = await launchBrowser();
const weights: Weight[] = [];
try {
  for (const [page, path, signedIn] of pages) {
    const w = await weigh(browser, page, path, signedIn ? session.cookie : null);
    console.log(`[bench] ${page}: ${kb(w.total)} kB`);
    weights.push(w);
  }
} finally {
  await browser.close();
}

const md = markdown(weights, now);
console.log(`\n${md}\n`);
writeFileSync("bench-output/weight.md", `${md}\n`);
writeFileSync(
  "bench-output/weight.json",
  JSON.stringify({ at: now.toISOString(), hourLogBudget: HOUR_LOG_BUDGET, budget: BUDGET, weights }, null, 2),
);
