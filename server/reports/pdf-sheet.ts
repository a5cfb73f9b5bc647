// The paper every Keelson report is printed on: A4 pages with Inter (the app's own face), a
// running head on every page after the first, a footer with "page n of N", section headings kept
// with what follows, tables whose header row is repeated on each page they run onto, tick boxes
// and write-in fields. Rows and paragraphs are never cut at a page's foot: a row moves whole to
// the next page, a paragraph longer than the room left continues there line by line.
import { readFileSync } from "node:fs";
import path from "node:path";
import PDFDocument from "pdfkit";

/**
 * Inter 4.001, the same release as the app's `app/fonts/inter-latin-wght-normal.woff2`, as static
 * TrueType files (Google Fonts' build, from the npm package @expo-google-fonts/inter 0.4.2; OFL,
 * `fonts/OFL.txt`). pdfkit's font library (fontkit) can neither subset a WOFF2 file nor give a
 * weight of a variable font read from one (both throw), and the app's file holds the Latin subset
 * only; these hold every script Inter draws (accented Latin, Greek, Cyrillic) and are subset into
 * each PDF, so a report carries only the glyphs it uses.
 */
const FONT_DIR = path.join(process.cwd(), "server/reports/fonts");
let fontFiles: { regular: Buffer; bold: Buffer } | null = null;
function fonts() {
  fontFiles ??= {
    regular: readFileSync(path.join(FONT_DIR, "Inter-Regular.ttf")),
    bold: readFileSync(path.join(FONT_DIR, "Inter-Bold.ttf")),
  };
  return fontFiles;
}

export const INK = "#111111";
export const GREY = "#555555";
const RULE = "#8a8a8a";
const FILL = "#ececec";

export type Face = "regular" | "bold";
export type TextStyle = { face?: Face; size?: number; color?: string; align?: "left" | "center" | "right" };

export type PageSetup = {
  layout?: "portrait" | "landscape";
  /** The document's title (its metadata, and what a PDF viewer shows). */
  title: string;
  subject: string;
  /** Printed small at the top of every page after the first, e.g. "WO-SUL-00042 · Main engine…". */
  runningHead: string;
  /** Printed at the foot of every page, before "page n of N". */
  footer: string;
};

/** A table cell: text, a tick box, or room to write in (with an optional unit printed small). */
export type CellText = { text: string; face?: Face; size?: number; color?: string; align?: "left" | "center" | "right" };
export type Cell =
  | string
  | CellText
  /** Lines one under the other, each in its own style (a number in bold, a component in grey). */
  | { lines: CellText[] }
  | { tick: true }
  | { writeIn: true; unit?: string };

export type Column = { header: string; width: number; align?: "left" | "center" | "right" };

const BODY = 9.5;
const PAD = 4;

export class Sheet {
  readonly doc: PDFKit.PDFDocument;
  readonly left: number;
  readonly width: number;
  private readonly top: number;
  private readonly bottom: number;
  private readonly setup: PageSetup;
  private chunks: Buffer[] = [];
  /** Heights already measured: a long list repeats its vessels, states and days. */
  private heights = new Map<string, number>();
  private done: Promise<Buffer>;

  constructor(setup: PageSetup) {
    this.setup = setup;
    const margins = { top: 40, bottom: 46, left: 42, right: 42 };
    this.doc = new PDFDocument({
      size: "A4",
      layout: setup.layout ?? "portrait",
      margins,
      bufferPages: true,
      autoFirstPage: false,
      // No standard font is ever loaded: every text is set in Inter.
      font: null as unknown as string,
      info: { Title: setup.title, Subject: setup.subject, Author: "Keelson", Creator: "Keelson" },
      displayTitle: true,
      lang: "en-GB",
    });
    this.doc.registerFont("regular", fonts().regular);
    this.doc.registerFont("bold", fonts().bold);
    this.done = new Promise((resolve, reject) => {
      this.doc.on("data", (chunk: Buffer) => this.chunks.push(chunk));
      this.doc.on("end", () => resolve(Buffer.concat(this.chunks)));
      this.doc.on("error", reject);
    });
    this.doc.addPage();
    this.left = margins.left;
    this.width = this.doc.page.width - margins.left - margins.right;
    this.top = margins.top;
    this.bottom = this.doc.page.height - margins.bottom;
    this.doc.font("regular").fontSize(BODY).fillColor(INK);
  }

  get y(): number {
    return this.doc.y;
  }
  set y(value: number) {
    this.doc.y = value;
  }

  /** Room left on this page. */
  get room(): number {
    return this.bottom - this.y;
  }

  private style({ face = "regular", size = BODY, color = INK }: TextStyle = {}) {
    this.doc.font(face).fontSize(size).fillColor(color);
  }

  /** The height `text` takes at `width` in a style. */
  heightOf(text: string, width: number, style: TextStyle = {}): number {
    const key = `${style.face ?? "regular"}|${style.size ?? BODY}|${width}|${text}`;
    const known = this.heights.get(key);
    if (known !== undefined) return known;
    this.style(style);
    const lines = this.shortLines(text, width);
    const height = lines ? lines.length * this.lineHeight() : this.doc.heightOfString(text || " ", { width, lineGap: 1 });
    this.heights.set(key, height);
    return height;
  }

  /** A line of the current style, as pdfkit advances it with a gap of 1 pt. */
  private lineHeight(): number {
    return this.doc.currentLineHeight(true) + 1;
  }

  /**
   * The lines of `text` with their widths in the current style when each fits its line, else null.
   * Most cells are (a number, a day, a state): they skip pdfkit's line breaking, measured and
   * written, which made a fleet's 2,000-line list take seconds.
   */
  private shortLines(text: string, width: number): { text: string; width: number }[] | null {
    const lines = (text || " ").split("\n").map((line) => ({ text: line, width: this.doc.widthOfString(line) }));
    return lines.every((l) => l.width <= width) ? lines : null;
  }

  /** A new page with the running head. */
  newPage() {
    this.doc.addPage();
    this.style({ size: 7.5, color: GREY });
    this.doc.text(this.setup.runningHead, this.left, this.top - 16, { width: this.width, height: 10, ellipsis: true });
    this.rule(this.top - 4, 0.5, RULE);
    this.y = this.top + 4;
  }

  /** Makes sure `height` fits on this page; starts a new one otherwise. Returns whether it did. */
  ensure(height: number): boolean {
    if (height <= this.room) return false;
    this.newPage();
    return true;
  }

  gap(points: number) {
    this.y = Math.min(this.y + points, this.bottom);
  }

  rule(y = this.y, weight = 0.75, color = INK) {
    this.doc.save().moveTo(this.left, y).lineTo(this.left + this.width, y).lineWidth(weight).strokeColor(color).stroke().restore();
  }

  /** Text across the page (or at `x` with `width`); continues on the next page when it is longer than the room left. */
  text(text: string, style: TextStyle = {}, x = this.left, width = this.width) {
    let rest = text;
    while (rest) {
      const height = this.heightOf(rest, width, style);
      if (height <= this.room) {
        this.write(rest, x, width, style);
        return;
      }
      const [head, tail] = this.splitToFit(rest, width, style);
      if (!head && this.y <= this.top + 8) {
        // Not a word fits on an empty page (never with these layouts): let pdfkit break it.
        this.write(rest, x, width, style);
        return;
      }
      if (head) this.write(head, x, width, style);
      this.newPage();
      rest = tail;
    }
  }

  private write(text: string, x: number, width: number, style: TextStyle) {
    this.style(style);
    const lines = this.shortLines(text, width);
    if (!lines) {
      this.doc.text(text, x, this.y, { width, lineGap: 1, align: style.align ?? "left" });
      return;
    }
    let y = this.y;
    for (const line of lines) {
      const shift = style.align === "right" ? width - line.width : style.align === "center" ? (width - line.width) / 2 : 0;
      if (line.text) this.doc.text(line.text, x + shift, y, { lineBreak: false });
      y += this.lineHeight();
    }
    this.y = y;
  }

  /** The longest run of whole words that fits in the room left, and the rest. */
  private splitToFit(text: string, width: number, style: TextStyle): [string, string] {
    const words = text.split(/(?<=\s)/);
    let lo = 0;
    let hi = words.length;
    while (lo < hi) {
      const mid = Math.ceil((lo + hi) / 2);
      if (this.heightOf(words.slice(0, mid).join(""), width, style) <= this.room) lo = mid;
      else hi = mid - 1;
    }
    return [words.slice(0, lo).join("").trimEnd(), words.slice(lo).join("")];
  }

  /** A section heading, kept on a page with at least `keep` points of what follows. */
  heading(text: string, keep = 60) {
    this.ensure(26 + keep);
    this.gap(8);
    this.text(text, { face: "bold", size: 11 });
    this.rule(this.y + 1, 0.75);
    this.gap(5);
  }

  /** "Label: value" pairs in `columns` columns, label small above value. */
  facts(pairs: readonly (readonly [string, string])[], columns = 3) {
    const colWidth = this.width / columns;
    for (let i = 0; i < pairs.length; i += columns) {
      const row = pairs.slice(i, i + columns);
      const height = Math.max(...row.map(([label, value]) => this.heightOf(label, colWidth - 8, { size: 7.5 }) + this.heightOf(value, colWidth - 8)));
      this.ensure(height + 6);
      const y = this.y;
      row.forEach(([label, value], j) => {
        const x = this.left + j * colWidth;
        this.y = y;
        this.write(label.toUpperCase(), x, colWidth - 8, { face: "bold", size: 7.5, color: GREY });
        this.write(value, x, colWidth - 8, {});
      });
      this.y = y + height + 6;
    }
  }

  /**
   * A table; a row that does not fit moves whole to the next page, where the header row is drawn
   * again under "`title` (continued)".
   */
  table(columns: readonly Column[], rows: readonly (readonly Cell[])[], options: { title?: string; minRowHeight?: number } = {}) {
    const minRow = options.minRowHeight ?? 18;
    const heights = rows.map((row) => Math.max(minRow, ...row.map((cell, i) => this.cellHeight(cell, columns[i]!))));
    const headerHeight = Math.max(...columns.map((c) => this.heightOf(c.header, c.width - 2 * PAD, { face: "bold", size: 8 }))) + 2 * PAD;
    this.ensure(headerHeight + (heights[0] ?? 0));
    this.tableHeader(columns, headerHeight);
    rows.forEach((row, r) => {
      const height = heights[r]!;
      if (this.ensure(height)) {
        if (options.title) this.text(`${options.title} (continued)`, { face: "bold", size: 9, color: GREY });
        this.gap(2);
        this.tableHeader(columns, headerHeight);
      }
      this.tableRow(columns, row, height);
    });
  }

  private cellLines(cell: Cell): CellText[] {
    if (typeof cell === "string") return [{ text: cell }];
    if ("text" in cell) return [cell];
    if ("lines" in cell) return cell.lines.filter((l) => l.text);
    return [];
  }

  private cellHeight(cell: Cell, column: Column): number {
    const lines = this.cellLines(cell);
    if (!lines.length) return 0;
    return lines.reduce((n, l) => n + this.heightOf(l.text, column.width - 2 * PAD, l), 0) + 2 * PAD;
  }

  private tableHeader(columns: readonly Column[], height: number) {
    const y = this.y;
    this.doc.save().rect(this.left, y, this.width, height).fillColor(FILL).fill().restore();
    let x = this.left;
    for (const c of columns) {
      this.y = y + PAD;
      this.write(c.header, x + PAD, c.width - 2 * PAD, { face: "bold", size: 8, align: c.align });
      x += c.width;
    }
    this.grid(columns, y, height);
    this.y = y + height;
  }

  private tableRow(columns: readonly Column[], row: readonly Cell[], height: number) {
    const y = this.y;
    let x = this.left;
    row.forEach((cell, i) => {
      const column = columns[i]!;
      const lines = this.cellLines(cell);
      if (lines.length) {
        this.y = y + PAD;
        for (const l of lines) this.write(l.text, x + PAD, column.width - 2 * PAD, { ...l, align: l.align ?? column.align });
      } else if (typeof cell === "object" && "tick" in cell) {
        this.tickBox(x + column.width / 2 - 6, y + Math.min(PAD + 1, (height - 12) / 2));
      } else if (typeof cell === "object" && "writeIn" in cell && cell.unit) {
        this.y = y + height - 12;
        this.write(cell.unit, x + PAD, column.width - 2 * PAD, { size: 7.5, color: GREY, align: "right" });
      }
      x += column.width;
    });
    this.grid(columns, y, height);
    this.y = y + height;
  }

  private grid(columns: readonly Column[], y: number, height: number) {
    const doc = this.doc.save().lineWidth(0.6).strokeColor(RULE);
    doc.rect(this.left, y, this.width, height).stroke();
    let x = this.left;
    for (const c of columns.slice(0, -1)) {
      x += c.width;
      doc.moveTo(x, y).lineTo(x, y + height).stroke();
    }
    doc.restore();
  }

  tickBox(x: number, y: number, size = 12) {
    this.doc.save().lineWidth(1).strokeColor(INK).rect(x, y, size, size).stroke().restore();
  }

  /**
   * Labelled lines to write on, side by side: `[["Counter reading (Main engine)", 1], ["h", 0]]` —
   * each field's share of the width; the label sits on the line's left, small.
   */
  writeInLine(fields: readonly { label: string; share: number; after?: string }[], lineHeight = 26) {
    this.ensure(lineHeight);
    const total = fields.reduce((n, f) => n + f.share, 0);
    const y = this.y;
    let x = this.left;
    for (const f of fields) {
      const w = (this.width * f.share) / total;
      this.style({ size: 8.5 });
      const labelWidth = f.label ? this.doc.widthOfString(f.label) + 6 : 0;
      if (f.label) this.doc.text(f.label, x, y + lineHeight - 12, { lineBreak: false });
      const end = x + w - 12 - (f.after ? this.doc.widthOfString(f.after) + 4 : 0);
      this.doc.save().lineWidth(0.6).strokeColor(INK).moveTo(x + labelWidth, y + lineHeight - 2).lineTo(end, y + lineHeight - 2).stroke().restore();
      if (f.after) {
        this.style({ size: 8.5, color: GREY });
        this.doc.text(f.after, end + 4, y + lineHeight - 12, { lineBreak: false });
      }
      x += w;
    }
    this.y = y + lineHeight + 2;
  }

  /** Empty ruled lines for remarks. */
  ruledLines(count: number, spacing = 22) {
    for (let i = 0; i < count; i++) {
      this.ensure(spacing);
      this.y += spacing;
      this.rule(this.y - 2, 0.5, RULE);
    }
    this.gap(4);
  }

  /** A framed block (cautions): a thick bar on the left, its content drawn by `draw` inside. */
  framed(draw: (x: number, width: number) => void, minHeight = 0) {
    const startPage = this.currentPageIndex();
    const y = this.y;
    const inset = 10;
    this.y += 6;
    draw(this.left + inset, this.width - inset - 6);
    this.gap(4);
    // A block that ran onto the next page is framed from that page's top.
    const top = this.currentPageIndex() === startPage ? y : this.top + 4;
    const height = Math.max(this.y - top, minHeight);
    this.doc.save().lineWidth(1).strokeColor(INK).rect(this.left, top, this.width, height).stroke();
    this.doc.rect(this.left, top, 4, height).fillColor(INK).fill().restore();
    this.y = top + height;
  }

  private currentPageIndex(): number {
    const range = this.doc.bufferedPageRange();
    return range.start + range.count - 1;
  }

  /** Draws every page's footer and returns the file. */
  async finish(): Promise<Buffer> {
    const range = this.doc.bufferedPageRange();
    for (let i = range.start; i < range.start + range.count; i++) {
      this.doc.switchToPage(i);
      // The footer sits in the bottom margin, where pdfkit would otherwise start a new page.
      const margin = this.doc.page.margins.bottom;
      this.doc.page.margins.bottom = 0;
      const y = this.doc.page.height - margin + 16;
      this.doc.save().moveTo(this.left, y - 5).lineTo(this.left + this.width, y - 5).lineWidth(0.5).strokeColor(RULE).stroke().restore();
      this.style({ size: 7.5, color: GREY });
      const page = `Page ${i - range.start + 1} of ${range.count}`;
      const pageWidth = this.doc.widthOfString(page);
      this.doc.text(this.setup.footer, this.left, y, { width: this.width - pageWidth - 12, height: 10, ellipsis: true });
      this.doc.text(page, this.left + this.width - pageWidth, y, { lineBreak: false });
      this.doc.page.margins.bottom = margin;
    }
    this.doc.end();
    return this.done;
  }
}
