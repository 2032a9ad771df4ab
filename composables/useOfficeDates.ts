import { DEFAULT_OFFICE_LOCALE, formatDate, formatDateTime, formatTime } from '~/shared/utils/dates'

/** Date formatting in the office's locale (runtime config `public.officeLocale`, env NUXT_PUBLIC_OFFICE_LOCALE). */
export function useOfficeDates() {
  const locale = String(useRuntimeConfig().public.officeLocale || DEFAULT_OFFICE_LOCALE)
  return {
    locale,
    dateTime: (value: string | number | Date) => formatDateTime(value, locale),
    date: (value: string | number | Date) => formatDate(value, locale),
    time: (value: string | number | Date) => formatTime(value, locale),
  }
}
