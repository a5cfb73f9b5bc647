import { csvResponse } from "@/server/export/csv";
import { withAccess } from "@/server/http/with-access";
import { exportRows, kindCsv, workbookOf, zipOf } from "@/server/import/export";
import { ExportQuery } from "@/server/import/template";

/**
 * The vessel's plan in the import layout: `?kind=routines` (or components, counters, last-done,
 * readings) as one CSV; without a kind one workbook with a worksheet per kind, or with
 * `?format=zip` a zip of a CSV per kind.
 */
export const GET = withAccess({ permission: "vessel:read", vessel: true, query: ExportQuery }, async ({ access, vessel, query }) => {
  const rows = await exportRows(access, vessel, { withReadings: !query.kind || query.kind === "readings" });
  const name = `${vessel.code}-${new Date().toISOString().slice(0, 10)}`;
  if (query.kind) return csvResponse(kindCsv(query.kind, rows[query.kind]), `${name}-${query.kind}.csv`);
  if (query.format === "zip") {
    return new Response(Buffer.from(await zipOf(rows)), {
      headers: {
        "content-type": "application/zip",
        "content-disposition": `attachment; filename="${name.replace(/[^\w.-]/g, "-")}-plan.zip"`,
        "cache-control": "no-store",
      },
    });
  }
  return new Response(Buffer.from(await workbookOf(rows)), {
    headers: {
      "content-type": "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
      "content-disposition": `attachment; filename="${name.replace(/[^\w.-]/g, "-")}-plan.xlsx"`,
      "cache-control": "no-store",
    },
  });
});
