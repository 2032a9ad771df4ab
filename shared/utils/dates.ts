/**
 * Dates as people in the office read them. Records keep ISO 8601 (UTC); screens show the office's
 * locale, en-GB unless the office sets another: 02/12/2026, 14:05 — day first, 24-hour clock.
 */
export const DEFAULT_OFFICE_LOCALE = 'en-GB'

type DateLike = string | number | Date

function asDate(value: DateLike): Date {
  return value instanceof Date ? value : new Date(value)
}

export function formatDateTime(value: DateLike, locale = DEFAULT_OFFICE_LOCALE): string {
  return asDate(value).toLocaleString(locale, { year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' })
}

export function formatDate(value: DateLike, locale = DEFAULT_OFFICE_LOCALE): string {
  return asDate(value).toLocaleDateString(locale, { year: 'numeric', month: '2-digit', day: '2-digit' })
}

export function formatTime(value: DateLike, locale = DEFAULT_OFFICE_LOCALE): string {
  return asDate(value).toLocaleTimeString(locale, { hour: '2-digit', minute: '2-digit', hourCycle: 'h23' })
}
