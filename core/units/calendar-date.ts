import { InputError } from './input-error';

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/**
 * Reads a calendar date written as ISO 8601 `YYYY-MM-DD` (the one form that sorts and that
 * no reader takes for day-month or month-day), and checks that the day exists.
 * @throws InputError naming `field`.
 * @example calendarDateParse('2025-04-12', 'date') // '2025-04-12'
 */
export function calendarDateParse(raw: unknown, field: string): string {
  if (typeof raw !== 'string')
    throw new InputError(
      field,
      `got ${raw === null ? 'null' : typeof raw}; expected a date such as "2025-04-12"`,
    );
  const text = raw.trim();
  const m = ISO_DATE.exec(text);
  if (!m)
    throw new InputError(
      field,
      `got ${JSON.stringify(raw.slice(0, 40))}; expected a date written YYYY-MM-DD, e.g. "2025-04-12"`,
    );
  const [year, month, day] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const d = new Date(Date.UTC(year, month - 1, day));
  if (d.getUTCFullYear() !== year || d.getUTCMonth() !== month - 1 || d.getUTCDate() !== day || year < 1900)
    throw new InputError(field, `${JSON.stringify(raw)} is not a day of the calendar`);
  return text;
}

const ISO_TIMESTAMP = /^(\d{4}-\d{2}-\d{2})T(\d{2}):(\d{2}):(\d{2})(\.\d{1,3})?Z$/;

/**
 * Reads a moment in UTC as the program writes one (`Date.prototype.toISOString`,
 * ISO 8601 `YYYY-MM-DDTHH:MM:SS.sssZ`, milliseconds optional): the day must exist, the
 * time be a time of day.
 * @throws InputError naming `field`.
 * @example timestampParse('2025-04-12T09:30:00.000Z', 'savedAt') // '2025-04-12T09:30:00.000Z'
 */
export function timestampParse(raw: unknown, field: string): string {
  const expected = 'expected a time such as "2025-04-12T09:30:00.000Z" (UTC, ISO 8601)';
  if (typeof raw !== 'string')
    throw new InputError(field, `got ${raw === null ? 'null' : typeof raw}; ${expected}`);
  const m = ISO_TIMESTAMP.exec(raw);
  if (!m) throw new InputError(field, `got ${JSON.stringify(raw.slice(0, 40))}; ${expected}`);
  try {
    calendarDateParse(m[1], field);
  } catch {
    throw new InputError(field, `"${raw}" is not a day of the calendar`);
  }
  if (Number(m[2]) > 23 || Number(m[3]) > 59 || Number(m[4]) > 59)
    throw new InputError(field, `"${raw}" is not a time of day`);
  return raw;
}
