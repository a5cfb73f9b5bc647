// The Backlog's URL read and written with its route handler's own schema (BacklogQuery).
import { describe, expect, it } from "vitest";
import { backlogExportSearch, backlogSearch, readBacklogUrl } from "./backlog-url";

describe("readBacklogUrl", () => {
  it("reads a link's filters as the route handler would", () => {
    const filter = readBacklogUrl(new URLSearchParams("state=late,out-of-tolerance&critical=true&q=piston"));
    expect(filter.state).toEqual(["late", "out-of-tolerance"]);
    expect(filter.critical).toBe(true);
    expect(filter.q).toBe("piston");
  });

  it("falls back to a refused filter's default and keeps the others", () => {
    const filter = readBacklogUrl(new URLSearchParams("state=late,bogus&q=purifier&dueBefore=31-12-2026"));
    expect(filter.state).toEqual(readBacklogUrl(new URLSearchParams()).state);
    expect(filter.dueBefore).toBeUndefined();
    expect(filter.q).toBe("purifier");
  });
});

describe("backlogSearch", () => {
  it("writes back what differs from the defaults, commas kept, and reads the same filter again", () => {
    const filter = readBacklogUrl(new URLSearchParams("state=late,window-open&engineStop=true"));
    const search = backlogSearch(filter);
    expect(search).toBe("state=late,window-open&engineStop=true");
    expect(readBacklogUrl(new URLSearchParams(search))).toEqual(filter);
  });

  it("writes nothing for the default filter, and the export leaves the paging out", () => {
    expect(backlogSearch(readBacklogUrl(new URLSearchParams()))).toBe("");
    const paged = readBacklogUrl(new URLSearchParams("page=3&q=valve"));
    expect(backlogSearch(paged)).toContain("page=3");
    expect(backlogExportSearch(paged)).toBe("q=valve");
  });
});
