import { csvResponse } from "@/server/export/csv";
import { withAccess } from "@/server/http/with-access";
import { ImportTemplateQuery, templateCsv } from "@/server/import/template";

/** The layout of one kind as an empty CSV (its header row), or with `example=yes` a filled example row. */
export const GET = withAccess(
  { permission: "register:edit", vessel: true, query: ImportTemplateQuery },
  async ({ query }) => csvResponse(templateCsv(query.kind, query.example), `${query.kind}${query.example ? "-example" : ""}.csv`),
);
