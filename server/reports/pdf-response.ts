// A report as the browser downloads it. An attachment, not inline: the route handlers' policy
// (`sandbox`, next.config.mjs) would keep a browser's PDF viewer from showing it in the tab.
export function pdfResponse(pdf: Uint8Array, filename: string): Response {
  return new Response(new Uint8Array(pdf), {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": `attachment; filename="${filename.replace(/[^\w.-]/g, "-")}"`,
      "content-length": String(pdf.byteLength),
      "cache-control": "no-store",
    },
  });
}
