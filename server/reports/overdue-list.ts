// The fleet's overdue list on paper (landscape): every late or out-of-tolerance work order, the
// worst first, as the Fleet board lists it, with the filters it was printed under.
import { type Column, GREY, Sheet } from "./pdf-sheet";

export type OverdueLine = {
  vessel: string;
  number: string;
  title: string;
  component: string;
  state: string;
  due: string;
  overdue: string;
  rank: string;
  notes: string;
};

export type OverdueList = {
  company: string;
  /** "Listed 5 Dec 2026 19:50 UTC, as the worker last computed the states." */
  listed: string;
  /** "Every vessel · late and out of tolerance" */
  filters: string;
  /** "3 out of tolerance · 12 late" */
  counts: string;
  truncated: string | null;
  lines: OverdueLine[];
};

export async function renderOverdueList(list: OverdueList): Promise<Buffer> {
  const sheet = new Sheet({
    layout: "landscape",
    title: `Overdue work: ${list.company}`,
    subject: "The fleet's late and out-of-tolerance work orders",
    runningHead: `Overdue work · ${list.company} · ${list.filters}`,
    footer: `Overdue work · ${list.company} · Keelson`,
  });
  sheet.text(`OVERDUE WORK · ${list.company}`, { face: "bold", size: 8.5, color: GREY });
  sheet.gap(2);
  sheet.text(`${list.counts}`, { face: "bold", size: 15 });
  sheet.text(`${list.filters}. ${list.listed} Due days are ship’s days.`, { size: 9 });
  if (list.truncated) sheet.text(list.truncated, { face: "bold", size: 9 });
  sheet.gap(4);
  sheet.rule(sheet.y, 1.5);
  sheet.gap(8);
  if (!list.lines.length) {
    sheet.text("Nothing is late or out of tolerance under these filters.", { size: 11 });
    return sheet.finish();
  }
  const fixed = 110 + 92 + 84 + 84 + 90 + 150;
  const columns: Column[] = [
    { header: "Vessel", width: 110 },
    { header: "Work order", width: sheet.width - fixed },
    { header: "State", width: 92 },
    { header: "Due", width: 84 },
    { header: "Overdue by", width: 84 },
    { header: "Rank", width: 90 },
    { header: "Notes", width: 150 },
  ];
  const small = (text: string) => ({ text, size: 8.5 });
  sheet.table(
    columns,
    list.lines.map((l) => [
      small(l.vessel),
      { lines: [{ text: `${l.number}  ${l.title}`, face: "bold" as const, size: 8.5 }, { text: l.component, size: 8, color: GREY }] },
      { text: l.state, size: 8.5, face: "bold" as const },
      small(l.due),
      small(l.overdue),
      small(l.rank),
      small(l.notes),
    ]),
    { title: "Overdue work", minRowHeight: 20 },
  );
  return sheet.finish();
}
