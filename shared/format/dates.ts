/**
 * The one way Rhomb writes dates and times: day, month name and year ("2 Dec 2026"), with a
 * 24-hour time when it matters ("2 Dec 2026, 14:05"), in the reader's time zone. Month names
 * avoid the 12/2 vs 2/12 ambiguity between labs in different countries.
 */
const DATE = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric" });
const DATE_TIME = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit", hourCycle: "h23" });

export function formatDate(value: string | number | Date): string {
  return DATE.format(new Date(value));
}

export function formatDateTime(value: string | number | Date): string {
  return DATE_TIME.format(new Date(value));
}
