/**
 * The instant a capture date stands for. A capture is dated by its calendar day (YYYY-MM-DD),
 * and the field model is evaluated at noon UTC of that day everywhere: the upload worker, the
 * command line, the demo data and the classroom scenarios. Noon keeps the day the same in
 * every time zone within twelve hours of UTC, and the model changes by far less than a
 * reading's noise within a day.
 */

/** Hour of the day (UTC) a capture date stands for; engineering choice, see above. */
export const CAPTURE_DATE_HOUR_UTC = 12;

const DAY_PATTERN = /^(\d{4})-(\d{2})-(\d{2})$/;

/** Noon UTC of a calendar day written YYYY-MM-DD, or null when the text is not a real date. */
export function parseCaptureDate(text: string): Date | null {
  const match = DAY_PATTERN.exec(text.trim());
  if (!match) return null;
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
  const date = new Date(Date.UTC(year, month - 1, day, CAPTURE_DATE_HOUR_UTC));
  // Date.UTC rolls 2026-02-30 over into March: such a day does not exist.
  if (date.getUTCFullYear() !== year || date.getUTCMonth() !== month - 1 || date.getUTCDate() !== day) return null;
  return date;
}

/** Noon UTC of a calendar day written YYYY-MM-DD; throws a RangeError naming the text otherwise. */
export function captureDateAtNoonUtc(day: string): Date {
  const date = parseCaptureDate(day);
  if (!date) throw new RangeError(`The capture date "${day}" is not a date written YYYY-MM-DD.`);
  return date;
}

/** The calendar day (YYYY-MM-DD, UTC) of an instant: the inverse of captureDateAtNoonUtc. */
export function captureDayOf(instant: Date): string {
  return instant.toISOString().slice(0, 10);
}
