// The Hour log form holds a row per counter; the batch sends only the filled ones, so the
// server's row N is the form's Nth filled row.
import { describe, expect, it } from "vitest";
import { emptyEntries, formFieldOfBatch, type HourLogForm, toBatch } from "./hour-log-form";

const A = "00000000-0000-4000-8000-00000000000a";
const B = "00000000-0000-4000-8000-00000000000b";
const C = "00000000-0000-4000-8000-00000000000c";

function form(values: string[]): HourLogForm {
  const entries = emptyEntries([A, B, C]).map((entry, i) => ({ ...entry, value: values[i] ?? "" }));
  return { shipDay: "2026-12-04", time: "08:00", entries };
}

describe("toBatch", () => {
  it("sends the filled rows only, trimmed, in the page's order", () => {
    expect(toBatch(form(["", " 1,020.5 ", "512"])).entries).toEqual([
      { counterId: B, value: "1,020.5" },
      { counterId: C, value: "512" },
    ]);
  });
});

describe("formFieldOfBatch", () => {
  it("puts the batch's row on the form row it came from, skipping the empty ones", () => {
    const f = form(["", "1020", "512"]);
    expect(formFieldOfBatch("entries.0.value", f)).toBe("entries.1.value");
    expect(formFieldOfBatch("entries.1.counterId", f)).toBe("entries.2.value");
  });

  it("leaves a field that is not a row's, or a row past the filled ones, as the server named it", () => {
    const f = form(["1020", "", ""]);
    expect(formFieldOfBatch("time", f)).toBe("time");
    expect(formFieldOfBatch("entries.4.value", f)).toBe("entries.4.value");
  });
});
