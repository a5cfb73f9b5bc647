// Reads a PDF the way a person's viewer would: pdf.js (Mozilla's renderer) opens the bytes and
// gives each page's text, so a test checks what is printed, not what the layout meant to print.
import { getDocument, VerbosityLevel } from "pdfjs-dist/legacy/build/pdf.mjs";

export type PdfText = {
  pages: string[];
  /** Every page's text, whitespace made single. */
  all: string;
  info: Record<string, unknown>;
  /** The embedded fonts' names ("ABCDEF+Inter-Regular": the prefix says it is a subset). */
  fonts: string[];
};

export async function readPdf(bytes: Uint8Array): Promise<PdfText> {
  const doc = await getDocument({
    data: new Uint8Array(bytes),
    verbosity: VerbosityLevel.ERRORS,
    disableFontFace: true,
    isEvalSupported: false,
  }).promise;
  const pages: string[] = [];
  for (let n = 1; n <= doc.numPages; n++) {
    const page = await doc.getPage(n);
    const content = await page.getTextContent();
    let text = "";
    for (const item of content.items) {
      if ("str" in item) text += item.str + (item.hasEOL ? "\n" : " ");
    }
    pages.push(text);
  }
  const { info } = await doc.getMetadata();
  await doc.destroy();
  // Font dictionaries are plain objects in the file (only content streams are compressed).
  const raw = Buffer.from(bytes).toString("latin1");
  const fonts = [...new Set([...raw.matchAll(/\/BaseFont \/([\w+-]+)/g)].map((m) => m[1]!))];
  return { pages, all: pages.join("\n").replace(/\s+/g, " "), info: info as Record<string, unknown>, fonts };
}

/** The text with whitespace made single, as `all` has it. */
export const squeeze = (text: string) => text.replace(/\s+/g, " ");
