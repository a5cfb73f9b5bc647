import { describe, expect, it } from "vitest";
import { escapeHtml, renderMail, type MailContent } from "./render";

const content: MailContent = {
  preheader: "3 jobs need you",
  title: "Aster Gale: due today",
  intro: "Good morning. Three jobs changed state overnight.",
  sections: [
    {
      heading: "Late",
      lines: [
        {
          text: "ME-001 Main engine: inspect <cylinder> unit 3",
          href: "https://keelson.example/wo/1",
          note: "due 3 May",
        },
        { text: "GE-2 Generator: oil & filter", note: "7 days late" },
      ],
    },
  ],
  action: { label: "Open the Backlog", href: "https://keelson.example/vessels/a/backlog" },
  footer: "Sent by Keelson for Brightwater Coastal Lines.",
  unsubscribe: { href: "https://keelson.example/unsubscribe?u=1&c=2&k=due-digest&t=x", kindLabel: "daily due digest" },
};

describe("renderMail", () => {
  it("escapes every piece of text in the HTML", () => {
    const { html } = renderMail({
      ...content,
      title: `<script>alert("x")</script>`,
      intro: `Tom's "quote" & <b>bold</b>`,
      sections: [{ heading: "<img src=x onerror=alert(1)>", lines: [{ text: "<i>x</i>", note: "</td>" }] }],
    });
    expect(html).not.toContain("<script>");
    expect(html).toContain("&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt;");
    expect(html).toContain("Tom&#39;s &quot;quote&quot; &amp; &lt;b&gt;bold&lt;/b&gt;");
    expect(html).not.toContain("<img");
    expect(html).toContain("&lt;i&gt;x&lt;/i&gt;");
    expect(html).toContain("&lt;/td&gt;");
  });

  it("links only web addresses and escapes them in the attribute", () => {
    const { html } = renderMail({
      ...content,
      sections: [
        {
          heading: "Links",
          lines: [
            { text: "bad", href: "javascript:alert(1)" },
            { text: "quoted", href: `https://keelson.example/a?x="><script>` },
          ],
        },
      ],
    });
    expect(html).not.toContain("javascript:");
    // The URL parser percent-encodes the quote and brackets; nothing can leave the attribute.
    expect(html).toContain('href="https://keelson.example/a?x=%22%3E%3Cscript%3E"');
  });

  it("keeps the words, links and unsubscribe line in the plain text", () => {
    const { text, html } = renderMail(content);
    expect(text).toContain("Aster Gale: due today\n=====================");
    expect(text).toContain(
      "- ME-001 Main engine: inspect <cylinder> unit 3\n  due 3 May\n  https://keelson.example/wo/1",
    );
    expect(text).toContain("Open the Backlog: https://keelson.example/vessels/a/backlog");
    expect(text).toContain("Unsubscribe: https://keelson.example/unsubscribe?u=1&c=2&k=due-digest&t=x");
    expect(html).toContain('href="https://keelson.example/unsubscribe?u=1&amp;c=2&amp;k=due-digest&amp;t=x"');
    expect(html).toContain("3 jobs need you");
  });

  it("has no unsubscribe line for account messages", () => {
    const { text, html } = renderMail({ ...content, unsubscribe: undefined });
    expect(text).not.toContain("Unsubscribe");
    expect(html).not.toContain("Unsubscribe");
  });
});

describe("escapeHtml", () => {
  it("escapes the five characters that matter in text and attributes", () => {
    expect(escapeHtml(`<a href="x">Tom's & co</a>`)).toBe("&lt;a href=&quot;x&quot;&gt;Tom&#39;s &amp; co&lt;/a&gt;");
  });
});
