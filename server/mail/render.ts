// One calm layout for every message Keelson sends: a light, table-based HTML body with inline
// styles (what mail clients render alike) and a plain-text twin with the same words and links.
// Pure: every piece of text is escaped here, so callers pass plain strings, never markup.

export type MailLine = { text: string; href?: string; note?: string };
export type MailSection = { heading: string; lines: MailLine[] };

export type MailContent = {
  /** The line a mail client shows beside the subject; hidden in the body. */
  preheader?: string;
  title: string;
  intro: string;
  sections: MailSection[];
  action: { label: string; href: string };
  footer?: string;
  unsubscribe?: { href: string; kindLabel: string };
};

const INK = { text: "#161d25", soft: "#4f5f71", faint: "#66778a", rule: "#d3dae2", page: "#f5f7f9" };
const TIDE = "#1a6c7d";
const FONT = "-apple-system, 'Segoe UI', Roboto, Helvetica, Arial, sans-serif";

export function escapeHtml(value: string): string {
  return value
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;")
    .replace(/'/g, "&#39;");
}

/** Only web links become anchors: a `javascript:` or relative href is shown as text instead. */
function safeHref(href: string | undefined): string | null {
  if (!href) return null;
  try {
    const url = new URL(href);
    return url.protocol === "https:" || url.protocol === "http:" ? url.toString() : null;
  } catch {
    return null;
  }
}

function link(text: string, href: string | undefined, style: string): string {
  const safe = safeHref(href);
  const label = escapeHtml(text);
  return safe ? `<a href="${escapeHtml(safe)}" style="${style}">${label}</a>` : label;
}

function renderLineHtml(line: MailLine): string {
  const note = line.note
    ? `<div style="color:${INK.faint};font-size:13px;line-height:18px;">${escapeHtml(line.note)}</div>`
    : "";
  return (
    `<tr><td style="padding:6px 0;border-top:1px solid ${INK.rule};font-size:14px;line-height:20px;color:${INK.text};">` +
    `${link(line.text, line.href, `color:${TIDE};text-decoration:underline;`)}${note}</td></tr>`
  );
}

function renderSectionHtml(section: MailSection): string {
  return (
    `<tr><td style="padding:18px 0 4px 0;">` +
    `<h2 style="margin:0 0 6px 0;font-size:15px;line-height:20px;font-weight:600;color:${INK.text};">${escapeHtml(section.heading)}</h2>` +
    `<table role="presentation" width="100%" cellpadding="0" cellspacing="0" border="0">${section.lines.map(renderLineHtml).join("")}</table>` +
    `</td></tr>`
  );
}

function renderHtml(content: MailContent): string {
  const preheader = content.preheader
    ? `<div style="display:none;max-height:0;overflow:hidden;opacity:0;color:transparent;">${escapeHtml(content.preheader)}</div>`
    : "";
  const action = safeHref(content.action.href);
  const button = action
    ? `<tr><td style="padding:22px 0 6px 0;"><table role="presentation" cellpadding="0" cellspacing="0" border="0"><tr>` +
      `<td style="background:${TIDE};border-radius:6px;">` +
      `<a href="${escapeHtml(action)}" style="display:inline-block;padding:10px 18px;font-family:${FONT};font-size:14px;font-weight:600;color:#ffffff;text-decoration:none;">${escapeHtml(content.action.label)}</a>` +
      `</td></tr></table></td></tr>`
    : "";
  const footerParts = [
    content.footer ? `<p style="margin:0 0 8px 0;">${escapeHtml(content.footer)}</p>` : "",
    content.unsubscribe
      ? `<p style="margin:0;">Don’t want the ${escapeHtml(content.unsubscribe.kindLabel)}? ` +
        `${link("Unsubscribe", content.unsubscribe.href, `color:${INK.soft};text-decoration:underline;`)} (one click, no sign-in).</p>`
      : "",
  ].join("");
  return [
    `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">`,
    `<meta name="color-scheme" content="light"><title>${escapeHtml(content.title)}</title></head>`,
    `<body style="margin:0;padding:0;background:${INK.page};">${preheader}`,
    `<table role="presentation" width="100%" cellpadding="0" cellspacing="0" border="0" style="background:${INK.page};"><tr><td align="center" style="padding:24px 12px;">`,
    `<table role="presentation" width="100%" cellpadding="0" cellspacing="0" border="0" style="max-width:600px;background:#ffffff;border:1px solid ${INK.rule};border-radius:8px;font-family:${FONT};">`,
    `<tr><td style="padding:16px 24px;border-bottom:1px solid ${INK.rule};font-size:13px;font-weight:700;letter-spacing:0.04em;color:${TIDE};">KEELSON</td></tr>`,
    `<tr><td style="padding:20px 24px 24px 24px;"><table role="presentation" width="100%" cellpadding="0" cellspacing="0" border="0">`,
    `<tr><td><h1 style="margin:0 0 8px 0;font-size:20px;line-height:26px;font-weight:700;color:${INK.text};">${escapeHtml(content.title)}</h1>`,
    `<p style="margin:0;font-size:14px;line-height:21px;color:${INK.soft};">${escapeHtml(content.intro)}</p></td></tr>`,
    content.sections.map(renderSectionHtml).join(""),
    button,
    `</table></td></tr>`,
    footerParts
      ? `<tr><td style="padding:14px 24px;border-top:1px solid ${INK.rule};font-size:12px;line-height:18px;color:${INK.faint};">${footerParts}</td></tr>`
      : "",
    `</table></td></tr></table></body></html>`,
  ].join("");
}

function renderText(content: MailContent): string {
  const out: string[] = [content.title, "=".repeat(Math.min(content.title.length, 72)), "", content.intro];
  for (const section of content.sections) {
    out.push("", section.heading, "-".repeat(Math.min(section.heading.length, 72)));
    for (const line of section.lines) {
      out.push(`- ${line.text}`);
      if (line.note) out.push(`  ${line.note}`);
      if (line.href) out.push(`  ${line.href}`);
    }
  }
  out.push("", `${content.action.label}: ${content.action.href}`);
  if (content.footer || content.unsubscribe) out.push("", "--");
  if (content.footer) out.push(content.footer);
  if (content.unsubscribe) {
    out.push(`Don’t want the ${content.unsubscribe.kindLabel}? Unsubscribe: ${content.unsubscribe.href}`);
  }
  return out.join("\n") + "\n";
}

export function renderMail(content: MailContent): { html: string; text: string } {
  return { html: renderHtml(content), text: renderText(content) };
}
