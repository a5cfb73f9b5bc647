// The port stay's work package on paper: the stay (arrival, departure, working day, the main
// engine's stop), the crew and their watches, each day's jobs on the clock with their people and
// man-hours and a box to tick when done, each person's hours, and the chief engineer's signature.
import { type Column, GREY, Sheet } from "./pdf-sheet";

export type PackageJobLine = {
  /** "08:00–12:00", or with the day when the job runs onto another: "Sat 5 Dec 08:00–10:00". */
  when: string;
  number: string;
  title: string;
  component: string;
  /** "engine stopped · critical · class-related" */
  flags: string;
  reason: string;
  team: string;
  people: string;
  manHours: string;
};

export type WorkPackage = {
  vessel: { name: string; code: string; imoNumber: string };
  port: string;
  /** "Accepted 3 Dec 2026 by …", "Proposed by Keelson: not accepted yet", … */
  status: string;
  facts: [string, string][];
  crew: string;
  watches: string[];
  cautions: string[];
  days: { label: string; summary: string; jobs: PackageJobLine[] }[];
  people: { name: string; byDay: string; total: string }[];
  /** Work the proposal could not place, with why (a proposal only). */
  leftOut: { number: string; title: string; why: string }[];
  /** Said when there is no package at all. */
  empty: string | null;
};

export async function renderWorkPackage(pkg: WorkPackage): Promise<Buffer> {
  const sheet = new Sheet({
    title: `Work package: ${pkg.port}, ${pkg.vessel.name}`,
    subject: `Port stay work package of ${pkg.vessel.name}`,
    runningHead: `Work package · ${pkg.port} · ${pkg.vessel.name}`,
    footer: `Work package ${pkg.port} · ${pkg.vessel.name} · Keelson`,
  });
  sheet.text(`WORK PACKAGE · ${pkg.vessel.name} · ${pkg.vessel.code} · IMO ${pkg.vessel.imoNumber}`, {
    face: "bold",
    size: 8.5,
    color: GREY,
  });
  sheet.gap(4);
  sheet.text(pkg.port, { face: "bold", size: 16 });
  sheet.text(pkg.status, { face: "bold", size: 9.5 });
  sheet.gap(4);
  sheet.rule(sheet.y, 1.5);
  sheet.gap(8);
  sheet.facts(pkg.facts);
  sheet.facts([["Crew on board", pkg.crew]], 1);
  if (pkg.watches.length) sheet.facts([["Port watches", pkg.watches.join("\n")]], 1);

  sheet.gap(6);
  sheet.framed((x, width) => {
    sheet.text("⚠ Before work starts", { face: "bold", size: 11 }, x, width);
    sheet.gap(2);
    for (const c of pkg.cautions) sheet.text(c, {}, x, width);
  });

  if (pkg.empty) {
    sheet.gap(10);
    sheet.text(pkg.empty, { size: 11 });
  }
  for (const day of pkg.days) {
    sheet.heading(`${day.label} — ${day.summary}`);
    if (!day.jobs.length) {
      sheet.text("No work planned on this day.", { color: GREY });
      continue;
    }
    dayTable(sheet, day.label, day.jobs);
  }
  if (pkg.people.length) {
    sheet.heading("Hours of each person");
    sheet.text("Maintenance hours placed on each person, besides port watches; rest hours are checked by the planner.", {
      size: 8.5,
      color: GREY,
    });
    sheet.gap(4);
    const columns: Column[] = [
      { header: "Person", width: 130 },
      { header: "By day", width: sheet.width - 130 - 70 },
      { header: "Total", width: 70, align: "right" },
    ];
    sheet.table(columns, pkg.people.map((p) => [p.name, p.byDay, p.total]), { title: "Hours of each person" });
  }
  if (pkg.leftOut.length) {
    sheet.heading("Left out of the proposal");
    const columns: Column[] = [
      { header: "Work order", width: 200 },
      { header: "Why it is not in the package", width: sheet.width - 200 },
    ];
    sheet.table(
      columns,
      pkg.leftOut.map((l) => [{ lines: [{ text: l.number, face: "bold", size: 8.5 }, { text: l.title, size: 8.5 }] }, { text: l.why, size: 8.5 }]),
      { title: "Left out" },
    );
  }
  signOff(sheet);
  return sheet.finish();
}

function dayTable(sheet: Sheet, label: string, jobs: PackageJobLine[]) {
  const columns: Column[] = [
    { header: "When", width: 78 },
    { header: "Work order", width: sheet.width - 78 - 130 - 52 - 36 },
    { header: "Team and people", width: 130 },
    { header: "Man-hours", width: 52, align: "right" },
    { header: "Done", width: 36, align: "center" },
  ];
  sheet.table(
    columns,
    jobs.map((j) => [
      { text: j.when, size: 8.5 },
      {
        lines: [
          { text: `${j.number}  ${j.title}`, face: "bold", size: 8.5 },
          { text: j.component, size: 8.5 },
          { text: j.flags, face: "bold", size: 8 },
          { text: j.reason, size: 8, color: GREY },
        ],
      },
      { text: [j.team, j.people].filter(Boolean).join("\n"), size: 8.5 },
      { text: j.manHours, size: 8.5 },
      { tick: true },
    ]),
    { title: label, minRowHeight: 24 },
  );
}

function signOff(sheet: Sheet) {
  sheet.heading("Sign-off", 70);
  sheet.writeInLine([
    { label: "Package accepted by the chief engineer", share: 3 },
    { label: "Signature", share: 2 },
    { label: "Date", share: 1.4 },
  ]);
  sheet.writeInLine([
    { label: "Work done and checked by", share: 3 },
    { label: "Signature", share: 2 },
    { label: "Date", share: 1.4 },
  ]);
}
