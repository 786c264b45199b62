import { describe, expect, it } from "vitest";
import { formatDate, formatDateTime } from "@shared/format/dates";

describe("dates as Rhomb writes them", () => {
  it("uses day, month name and year, never an ambiguous 12/2", () => {
    const d = new Date(2026, 11, 2, 14, 5);
    expect(formatDate(d)).toBe("2 Dec 2026");
    expect(formatDateTime(d)).toBe("2 Dec 2026, 14:05");
  });

  it("reads ISO strings from the API", () => {
    const iso = new Date(2026, 0, 13, 9, 30).toISOString();
    expect(formatDate(iso)).toBe("13 Jan 2026");
    expect(formatDateTime(iso)).toBe("13 Jan 2026, 09:30");
  });
});
