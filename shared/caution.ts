/**
 * The caution every page, printed sheet, register and e-mail of Tendonbook carries. (An issued
 * report carries its own, `REPORT_CAUTION` in shared/report/render.ts, frozen with it as issued.)
 */
export const CAUTION = 'Results are for a competent engineer to verify; the local code, its national annex and licensed practice govern.'
