import type { H3Event } from 'h3'
import { desc, eq } from 'drizzle-orm'
import { alias } from 'drizzle-orm/mysql-core'
import { OFFICE_LOGO_MAX_BYTES, officeDetailsSchema } from '../../shared/schemas/office'
import type { Tx } from '../utils/audit'
import { sha256Hex } from '../utils/hashing'

type SessionUser = { id: number, name: string, email: string, role: import('../../shared/types/roles').Role }

/** What the title block prints: the office's name and its logo as a data: URL (header templates load nothing). */
export interface OfficeStamp {
  version: number
  name: string
  logoDataUrl: string | null
}

const LOGO_TYPES = { 'image/png': 'png', 'image/jpeg': 'jpg' } as const

/** The version an approval freezes: the newest, or null before the office has any details. */
export async function officeVersionInForce(tx: Tx): Promise<number | null> {
  const [row] = await tx.select({ id: tables.officeDetails.id }).from(tables.officeDetails).orderBy(desc(tables.officeDetails.id)).limit(1)
  return row?.id ?? null
}

/** The details in force and who set them, for the admin page (the logo through its own route). */
export async function currentOfficeDetails() {
  const o = tables.officeDetails
  const by = alias(tables.users, 'by')
  const [row] = await useDb().select({ version: o.id, name: o.name, logoMime: o.logoMime, logoBytes: o.logoBytes, logoSha256: o.logoSha256, createdAt: o.createdAt, createdByName: by.name })
    .from(o).innerJoin(by, eq(by.id, o.createdBy)).orderBy(desc(o.id)).limit(1)
  return row ?? null
}

/** A version's logo bytes, checked against the recorded hash. @throws 404 none, 410 missing, 500 altered. */
export async function officeLogo(version: number) {
  const [row] = await useDb().select().from(tables.officeDetails).where(eq(tables.officeDetails.id, version))
  if (!row?.logoStorageKey) throw createError({ statusCode: 404, message: `Office details version ${version} has no logo` })
  const bytes = await readStored(row.logoStorageKey)
  if (!bytes) throw createError({ statusCode: 410, message: 'The office logo is missing from storage' })
  if (sha256Hex(bytes) !== row.logoSha256) throw createError({ statusCode: 500, message: 'The stored office logo no longer matches its recorded hash' })
  return { mime: row.logoMime ?? 'application/octet-stream', bytes }
}

/** The name and logo of one version, for a printed title block; null version: no office details. */
export async function officeStamp(version: number | null): Promise<OfficeStamp | null> {
  if (version === null) return null
  const [row] = await useDb().select({ name: tables.officeDetails.name, logo: tables.officeDetails.logoStorageKey }).from(tables.officeDetails).where(eq(tables.officeDetails.id, version))
  if (!row) return null
  const logo = row.logo ? await officeLogo(version) : null
  return { version, name: row.name, logoDataUrl: logo ? `data:${logo.mime};base64,${Buffer.from(logo.bytes).toString('base64')}` : null }
}

/**
 * Saves a new version of the office details from a multipart form (name, logo=keep|remove, and an
 * optional PNG or JPEG file `logoFile`). Earlier versions stay: approvals refer to them.
 * @throws 400 naming the field, 413/415 for the file.
 */
export async function saveOfficeDetails(event: H3Event, user: SessionUser) {
  const { file, fields } = await readUpload(event, { field: 'logoFile', accepted: LOGO_TYPES, acceptedWords: 'a PNG or JPEG image', maxBytes: OFFICE_LOGO_MAX_BYTES, required: false })
  const parsed = officeDetailsSchema.safeParse(fields)
  if (!parsed.success) invalidInput(parsed.error, { name: 'Office name', logo: 'Logo' })
  const body = parsed.data
  let logo: { logoStorageKey: string | null, logoMime: string | null, logoBytes: number | null, logoSha256: string | null } = { logoStorageKey: null, logoMime: null, logoBytes: null, logoSha256: null }
  if (file) {
    const logoStorageKey = generatedKey('office', file.extension)
    await writeStored(logoStorageKey, file.bytes)
    logo = { logoStorageKey, logoMime: file.mime, logoBytes: file.bytes.length, logoSha256: sha256Hex(file.bytes) }
  }
  await historyTransaction(async (tx) => {
    if (!file && body.logo === 'keep') {
      const [previous] = await tx.select().from(tables.officeDetails).orderBy(desc(tables.officeDetails.id)).limit(1).for('update')
      if (previous) logo = { logoStorageKey: previous.logoStorageKey, logoMime: previous.logoMime, logoBytes: previous.logoBytes, logoSha256: previous.logoSha256 }
    }
    const [{ id }] = await tx.insert(tables.officeDetails).values({ name: body.name, ...logo, createdBy: user.id, createdAt: new Date() }).$returningId()
    await logWrittenRow(tx, 'office-details', id)
    await recordAudit(event, { action: 'office.details', subject: body.name, actorId: user.id, detail: { version: id, logoSha256: logo.logoSha256 } }, tx)
  })
  return currentOfficeDetails()
}
