import type { H3Event } from 'h3'
import { desc, eq } from 'drizzle-orm'
import { alias } from 'drizzle-orm/mysql-core'
import { sha256Hex } from '../utils/hashing'
import type { Runner } from '../database/history-log'

type SessionUser = { id: number, name: string, email: string, role: import('../../shared/types/roles').Role }

export const ATTACHMENT_MAX_BYTES = 10 * 1024 * 1024

/** Types accepted, decided by the file's content (magic numbers), never by its name. */
const ACCEPTED: Record<string, string> = { 'application/pdf': 'pdf', 'image/png': 'png', 'image/jpeg': 'jpg' }

export async function uploadAttachment(event: H3Event, sheetId: number, user: SessionUser) {
  const [sheet] = await useDb().select({ id: tables.sheets.id, reference: tables.sheets.reference }).from(tables.sheets).where(eq(tables.sheets.id, sheetId))
  if (!sheet) throw createError({ statusCode: 404, message: `No calc sheet with id ${sheetId}` })
  const { file } = await readUpload(event, { accepted: ACCEPTED, acceptedWords: 'a PDF, PNG or JPEG', maxBytes: ATTACHMENT_MAX_BYTES })
  // a required file: readUpload throws when there is none
  const { bytes, extension, mime } = file!
  const sha256 = sha256Hex(bytes)
  const storageKey = generatedKey(`attachments:${sheetId}`, extension)
  await writeStored(storageKey, bytes)
  const filename = storedFileName(file!.filename, extension, 'attachment')
  const id = await historyTransaction(async (tx) => {
    const [{ id }] = await tx.insert(tables.attachments).values({ sheetId, storageKey, filename, mime, bytes: bytes.length, sha256, uploadedBy: user.id, createdAt: new Date() }).$returningId()
    await logWrittenRow(tx, 'attachment', id)
    await recordAudit(event, { action: 'attachment.uploaded', subject: `${sheet.reference}: ${filename}`, actorId: user.id, detail: { attachmentId: id, sha256, mime } }, tx)
    return id
  })
  return { id, filename, mime: mime, bytes: bytes.length, sha256 }
}

export async function listAttachments(sheetId: number) {
  const a = tables.attachments
  const uploader = alias(tables.users, 'uploader')
  return useDb().select({ id: a.id, filename: a.filename, mime: a.mime, bytes: a.bytes, sha256: a.sha256, createdAt: a.createdAt, uploadedByName: uploader.name })
    .from(a).innerJoin(uploader, eq(uploader.id, a.uploadedBy)).where(eq(a.sheetId, sheetId)).orderBy(desc(a.id))
}

export async function attachmentFile(id: number, runner: Pick<Runner, 'select'> = useDb()) {
  const [row] = await runner.select().from(tables.attachments).where(eq(tables.attachments.id, id))
  if (!row) throw createError({ statusCode: 404, message: `No attachment with id ${id}` })
  const bytes = await readStored(row.storageKey)
  if (!bytes) throw createError({ statusCode: 410, message: `${row.filename} is missing from storage` })
  if (sha256Hex(bytes) !== row.sha256) throw createError({ statusCode: 500, message: `${row.filename} no longer matches its recorded hash` })
  return { row, bytes }
}
