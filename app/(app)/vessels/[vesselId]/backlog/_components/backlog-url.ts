// The Backlog's URL is its route handler's query: read with the same schema, written back with the
// same names, so a link to the page is a link to the list.
import { BacklogQuery, type BacklogFilter } from "@/server/backlog/contract";

const DEFAULTS = BacklogQuery.parse({});

/**
 * The filter a URL asks for. A value the schema refuses (a hand-edited link, an old bookmark) falls
 * back to its default rather than blanking the page: the page then shows, and asks for, what it used.
 */
export function readBacklogUrl(params: URLSearchParams): BacklogFilter {
  const raw = Object.fromEntries(params);
  const parsed = BacklogQuery.safeParse(raw);
  if (parsed.success) return parsed.data;
  const refused = new Set(parsed.error.issues.map((issue) => issue.path[0]));
  const kept = BacklogQuery.safeParse(Object.fromEntries(Object.entries(raw).filter(([key]) => !refused.has(key))));
  return kept.success ? kept.data : DEFAULTS;
}

/** The query for a filter: what equals the schema's default is left out, a list is comma-separated. */
export function backlogSearch(filter: BacklogFilter): string {
  const q = new URLSearchParams();
  for (const [key, value] of Object.entries(filter) as [keyof BacklogFilter, BacklogFilter[keyof BacklogFilter]][]) {
    const text = wordsOf(value);
    if (text && text !== wordsOf(DEFAULTS[key])) q.set(key, text);
  }
  // Commas stay commas: the state list reads as it is written.
  return q.toString().replace(/%2C/g, ",");
}

/** The query for the CSV: the filters and sort without the paging, as the export carries every page. */
export function backlogExportSearch(filter: BacklogFilter): string {
  return backlogSearch({ ...filter, page: DEFAULTS.page, pageSize: DEFAULTS.pageSize });
}

function wordsOf(value: BacklogFilter[keyof BacklogFilter]): string {
  if (Array.isArray(value)) return value.join(",");
  if (value === true) return "true";
  if (value === false || value === undefined) return "";
  return String(value);
}
