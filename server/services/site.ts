import { and, eq, inArray, like } from 'drizzle-orm'
import type { HeightRow, TendonHeightSchedule } from '../../shared/engine/site/tendon-heights'
import type { StressingSchedule } from '../../shared/engine/site/stressing'
import { parseVerifyQuery } from '../utils/hashing'
import { verificationRef } from '../../shared/utils/verification-ref'
import { getRevisionDetail, sheetRevisionStatuses } from './revisions'

type SessionUser = { id: number, name: string, email: string, role: import('../../shared/types/roles').Role }

/**
 * What the site crew needs from an approved revision, found by the verification reference printed
 * on its sealed PDF: the tendon-height schedule (chair heights) and the stressing record. Only
 * revisions of the caller's projects are found; a reference of any other reads as unknown.
 * @throws 400 for text that is not a reference, 404 for an unknown one, 409 for a revision not approved.
 */
export async function siteView(text: string, user: SessionUser) {
  const parsed = parseVerifyQuery(text)
  if (parsed?.kind !== 'ref') throw createError({ statusCode: 400, message: `“${text.slice(0, 40)}” is not a verification reference: it reads TB-XXXX-XXXX-XXXX, as printed at the foot of each page of the sealed PDF`, data: { fields: { reference: 'A reference like TB-1A2B-3C4D-5E6F' } } })
  const reference = parsed.value
  const prefix = reference.replace(/^TB-/, '').replace(/-/g, '').toLowerCase()
  const projects = await memberProjectIds(user.id)
  const r = tables.revisions
  const found = projects.length
    ? await useDb().select({ id: r.id, contentHash: r.contentHash, sheetId: r.sheetId }).from(r).innerJoin(tables.sheets, eq(tables.sheets.id, r.sheetId))
      .where(and(like(r.contentHash, `${prefix}%`), inArray(tables.sheets.projectId, projects)))
    : []
  const match = found.find(x => verificationRef(x.contentHash) === reference)
  if (!match) throw createError({ statusCode: 404, message: `No revision of your projects has the verification reference ${reference}` })

  const detail = await getRevisionDetail(match.id, user)
  if (!detail.status.contractCode) {
    throw createError({ statusCode: 409, message: `${detail.sheet.reference} ${detail.code} is ${detail.status.label.toLowerCase()}, not approved: only an approved revision goes to site` })
  }
  // a later approval supersedes this one: the site must know which revision is current
  const statuses = await sheetRevisionStatuses(useDb(), match.sheetId)
  const currentId = [...statuses.entries()].filter(([, s]) => s.contractCode && !s.superseded).map(([id]) => id).at(-1)
  const current = currentId !== undefined && currentId !== match.id
    ? await useDb().select({ contentHash: r.contentHash }).from(r).where(eq(r.id, currentId)).then(([row]) => ({ code: statuses.get(currentId)!.contractCode!, reference: verificationRef(row!.contentHash) }))
    : null

  const [row] = await useDb().select({ results: r.results }).from(r).where(eq(r.id, match.id))
  const site = (row!.results as { site?: { heights: TendonHeightSchedule, stressing: StressingSchedule } }).site
  if (!site) throw createError({ statusCode: 409, message: `${detail.sheet.reference} ${detail.code} has no site schedules: its design model does not make them` })
  const heightRow = (h: HeightRow) => ({ x: h.x, xGlobal: h.xGlobal, kind: h.kind, chair: h.chair, underside: h.underside })
  return {
    reference,
    revisionId: detail.id,
    code: detail.status.contractCode,
    checkedAs: detail.code,
    status: detail.status.label,
    current,
    project: { jobNumber: detail.project.jobNumber, name: detail.project.name, site: detail.project.site },
    sheet: { reference: detail.sheet.reference, title: detail.sheet.title, partOfStructure: detail.sheet.partOfStructure },
    madeBy: detail.author.name,
    approvedBy: detail.approvedBy ? { name: detail.approvedBy.name, at: detail.approvedBy.at } : null,
    heights: { spacing: site.heights.spacing, roundTo: site.heights.roundTo, spans: site.heights.spans.map(s => ({ span: s.span, L: s.L, rows: s.rows.map(heightRow) })) },
    stressing: {
      tolerance: site.stressing.tolerance,
      tendons: site.stressing.tendons.map(t => ({ id: t.id, ends: t.ends, Pjack: t.Pjack, length: t.length, extension: t.extension, band: t.band, segments: t.segments.length })),
    },
  }
}
