import { describe, expect, it } from "vitest";
import { displayName, sniffType } from "./sniff";

const bytes = (...values: (number | string)[]) =>
  new Uint8Array(values.flatMap((v) => (typeof v === "string" ? [...v].map((c) => c.charCodeAt(0)) : [v])));

// Signatures as published: PNG file signature (RFC 2083 §3.1), JPEG SOI marker FFD8 (ITU-T T.81
// Table B.1), WebP's RIFF file header (RFC 9649), PDF file header (ISO 32000-1 §7.5.2). None is in
// ../shared/SOURCES.md: the byte values are quoted from memory of those documents.
describe("sniffType", () => {
  it("knows the four kept types by their first bytes", () => {
    expect(sniffType(bytes(0x89, "PNG", 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13))).toBe("image/png");
    expect(sniffType(bytes(0xff, 0xd8, 0xff, 0xe0, 0, 16, "JFIF"))).toBe("image/jpeg");
    expect(sniffType(bytes("RIFF", 0x24, 0, 0, 0, "WEBPVP8 "))).toBe("image/webp");
    expect(sniffType(bytes("%PDF-1.7\n"))).toBe("application/pdf");
  });

  it("refuses text, other RIFF files and short files whatever their name says", () => {
    expect(sniffType(bytes("not a picture, just text"))).toBeNull();
    expect(sniffType(bytes("RIFF", 0x24, 0, 0, 0, "WAVEfmt "))).toBeNull();
    expect(sniffType(bytes(0x89, "PN"))).toBeNull();
    expect(sniffType(new Uint8Array())).toBeNull();
    expect(sniffType(bytes("<svg xmlns='http://www.w3.org/2000/svg'/>"))).toBeNull();
  });
});

describe("displayName", () => {
  it("keeps the base name only and gives a nameless file one", () => {
    expect(displayName("C:\\fakepath\\liner 3.jpg", "image/jpeg")).toBe("liner 3.jpg");
    expect(displayName("../../etc/passwd", "image/png")).toBe("passwd");
    expect(displayName(" \u0007 ", "image/webp")).toBe("photo.webp");
    expect(displayName("", "application/pdf")).toBe("document.pdf");
    expect(displayName("x".repeat(300), "image/png")).toHaveLength(200);
  });
});
