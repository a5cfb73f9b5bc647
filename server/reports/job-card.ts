// The job card: a work order as a paper form for the engine room. The job and its due point, the
// cautions, the checklist with a box per step, the measurements with their limits and room to
// write the values, the parts to have ready, lines for what was done and the sign-off. Nothing is
// filled in beforehand: the day, the counter reading and the man-hours are written by hand.
import { type Column, GREY, Sheet } from "./pdf-sheet";

export type JobCard = {
  vessel: { name: string; code: string; imoNumber: string };
  number: string;
  title: string;
  component: { code: string; name: string };
  /** "Planned maintenance, occurrence 3" or "Corrective: defect D-SUL-0004". */
  kind: string;
  /** The limits in force, in words: "12 Jun 2026 · at 12,431 h". */
  due: string;
  window: string;
  interval: string | null;
  /** The counter whose reading is written at completion; null for calendar work. */
  counter: string | null;
  /** What is planned (never pre-filled as what was spent). */
  plannedEffort: string;
  flags: string[];
  description: string;
  defect: { heading: string; text: string } | null;
  cautions: { title: string; text: string }[];
  /** Said under the cautions: Keelson defers to the maker, the regulations and class. */
  cautionsFootnote: string[];
  checklist: string[];
  measurements: { name: string; unit: string; lower: string; upper: string }[];
  /** The routine's own words on parts, and the catalogue's parts the job needs. */
  partsNote: string;
  parts: { number: string; description: string; needed: string }[];
};

export async function renderJobCard(card: JobCard): Promise<Buffer> {
  const sheet = new Sheet({
    title: `Job card ${card.number}: ${card.title}`,
    subject: `${card.vessel.name}: ${card.component.code} ${card.component.name}`,
    runningHead: `${card.number} · ${card.title} · ${card.component.code} · ${card.vessel.name}`,
    footer: `Job card ${card.number} · ${card.vessel.name} · Keelson`,
  });
  head(sheet, card);
  cautions(sheet, card);
  checklist(sheet, card);
  measurements(sheet, card);
  parts(sheet, card);
  record(sheet, card);
  signOff(sheet);
  return sheet.finish();
}

function head(sheet: Sheet, card: JobCard) {
  const { doc } = sheet;
  const top = sheet.y;
  sheet.text(`JOB CARD · ${card.vessel.name} · ${card.vessel.code} · IMO ${card.vessel.imoNumber}`, {
    face: "bold",
    size: 8.5,
    color: GREY,
  });
  doc.font("bold").fontSize(15);
  const numberWidth = doc.widthOfString(card.number);
  doc.text(card.number, sheet.left + sheet.width - numberWidth, top - 2, { lineBreak: false });
  sheet.y = Math.max(sheet.y, top + 16);
  sheet.gap(4);
  sheet.text(card.title, { face: "bold", size: 15 });
  sheet.text(`${card.component.code}  ${card.component.name}`, { size: 11 });
  if (card.flags.length) {
    sheet.gap(2);
    sheet.text(card.flags.join("  ·  "), { face: "bold", size: 9.5 });
  }
  sheet.gap(4);
  sheet.rule(sheet.y, 1.5);
  sheet.gap(8);
  sheet.facts([
    ["Due", card.due],
    ["Window", card.window],
    ["Interval", card.interval ?? "—"],
    ["Work", card.kind],
    ["Planned effort", card.plannedEffort],
    ["Counter", card.counter ?? "none: calendar work"],
  ]);
  if (card.description) {
    sheet.gap(2);
    sheet.text(card.description);
  }
  if (card.defect) {
    sheet.heading(card.defect.heading, 30);
    sheet.text(card.defect.text);
  }
}

function cautions(sheet: Sheet, card: JobCard) {
  const lines = card.cautions.map((c) => ({ title: c.title, text: c.text }));
  const height =
    30 +
    lines.reduce((n, c) => n + sheet.heightOf(`${c.title}. ${c.text}`, sheet.width - 30) + 3, 0) +
    card.cautionsFootnote.reduce((n, t) => n + sheet.heightOf(t, sheet.width - 30, { face: "bold", size: 8.5 }), 0);
  sheet.gap(10);
  sheet.ensure(Math.min(height, 200));
  sheet.framed((x, width) => {
    sheet.text("⚠ Before you start", { face: "bold", size: 11 }, x, width);
    sheet.gap(3);
    for (const c of lines) {
      sheet.text(`${c.title}. ${c.text}`, {}, x, width);
      sheet.gap(3);
    }
    sheet.gap(2);
    for (const t of card.cautionsFootnote) sheet.text(t, { face: "bold", size: 8.5 }, x, width);
  });
}

function checklist(sheet: Sheet, card: JobCard) {
  sheet.heading("Checklist");
  if (!card.checklist.length) {
    sheet.text("No checklist is kept on the routine: follow the maker’s instruction manual.");
    return;
  }
  const columns: Column[] = [
    { header: "No.", width: 30, align: "right" },
    { header: "Step", width: sheet.width - 30 - 44 - 70 },
    { header: "Done", width: 44, align: "center" },
    { header: "Initials", width: 70 },
  ];
  sheet.table(
    columns,
    card.checklist.map((step, i) => [String(i + 1), step, { tick: true }, ""]),
    { title: "Checklist", minRowHeight: 22 },
  );
}

function measurements(sheet: Sheet, card: JobCard) {
  if (!card.measurements.length) return;
  sheet.heading("Measurements");
  sheet.text("Write each value as measured. A value outside its limits is reported as a defect.", { size: 8.5, color: GREY });
  sheet.gap(4);
  const columns: Column[] = [
    { header: "Measurement", width: sheet.width - 70 - 70 - 140 - 50 },
    { header: "Lower limit", width: 70, align: "right" },
    { header: "Upper limit", width: 70, align: "right" },
    { header: "Value measured", width: 140 },
    { header: "Within limits", width: 50, align: "center" },
  ];
  sheet.table(
    columns,
    card.measurements.map((m) => [m.name, m.lower, m.upper, { writeIn: true, unit: m.unit }, { tick: true }]),
    { title: "Measurements", minRowHeight: 34 },
  );
}

function parts(sheet: Sheet, card: JobCard) {
  if (!card.partsNote && !card.parts.length) return;
  sheet.heading("Spare parts to have ready");
  if (card.partsNote) sheet.text(card.partsNote);
  if (card.parts.length) {
    sheet.gap(4);
    const columns: Column[] = [
      { header: "Part number", width: 100 },
      { header: "Description", width: sheet.width - 100 - 70 - 80 },
      { header: "Needed", width: 70, align: "right" },
      { header: "Used", width: 80 },
    ];
    sheet.table(
      columns,
      card.parts.map((p) => [p.number, p.description, p.needed, { writeIn: true }]),
      { title: "Spare parts", minRowHeight: 22 },
    );
  }
}

function record(sheet: Sheet, card: JobCard) {
  sheet.heading("Record of the work", 150);
  sheet.writeInLine([
    { label: "Done on (ship’s day)", share: 3 },
    { label: "Time", share: 2 },
  ]);
  sheet.writeInLine([
    card.counter
      ? { label: `Counter reading (${card.counter})`, share: 3, after: "h" }
      : { label: "Counter reading", share: 3, after: "h (if any)" },
    { label: "Man-hours spent", share: 2, after: "h" },
  ]);
  sheet.writeInLine([{ label: "Worked by (rank and name)", share: 1 }]);
  sheet.writeInLine([{ label: "", share: 1 }]);
  sheet.gap(6);
  sheet.text("Remarks (what was found, what was renewed, anything left to do)", { size: 8.5 });
  sheet.ruledLines(5);
}

function signOff(sheet: Sheet) {
  const boxes = ["Done by", "Answered for by (engineer responsible)", "Approved by the chief engineer"];
  const height = 112;
  sheet.heading("Sign-off", height);
  const y = sheet.y;
  const gap = 10;
  const w = (sheet.width - gap * (boxes.length - 1)) / boxes.length;
  const { doc } = sheet;
  boxes.forEach((title, i) => {
    const x = sheet.left + i * (w + gap);
    doc.save().lineWidth(0.8).strokeColor("#111111").rect(x, y, w, height).stroke().restore();
    sheet.y = y + 6;
    sheet.text(title, { face: "bold", size: 9 }, x + 8, w - 16);
    ["Name and rank", "Signature", "Date"].forEach((label, j) => {
      const lineY = y + 46 + j * 26;
      doc.font("regular").fontSize(7.5).fillColor(GREY).text(label, x + 8, lineY - 10, { lineBreak: false });
      doc.save().lineWidth(0.6).strokeColor("#111111").moveTo(x + 8, lineY + 6).lineTo(x + w - 8, lineY + 6).stroke().restore();
    });
  });
  sheet.y = y + height + 4;
}
