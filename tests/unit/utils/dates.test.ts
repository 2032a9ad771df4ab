import { describe, expect, it } from 'vitest'
import { formatDate, formatDateTime, formatTime } from '../../../shared/utils/dates'

// 2 December 2026, 14:05 UTC: day first in en-GB, never the month first
const at = new Date(Date.UTC(2026, 11, 2, 14, 5))

describe('dates in the office locale', () => {
  it('shows en-GB by default: day, month, year and a 24-hour clock', () => {
    const tz = Intl.DateTimeFormat().resolvedOptions().timeZone
    const expected = new Intl.DateTimeFormat('en-GB', { timeZone: tz, day: '2-digit', month: '2-digit', year: 'numeric' }).format(at)
    expect(formatDate(at)).toBe(expected)
    expect(formatDate('2026-12-02T12:00:00Z')).toMatch(/^02\/12\/2026$/)
    expect(formatDateTime('2026-12-02T12:00:00Z')).toMatch(/^02\/12\/2026, \d\d:\d\d$/)
    expect(formatTime(at)).toMatch(/^\d\d:\d\d$/)
  })

  it('follows another office locale when set', () => {
    expect(formatDate('2026-12-02T12:00:00Z', 'de-DE')).toBe('02.12.2026')
  })
})
