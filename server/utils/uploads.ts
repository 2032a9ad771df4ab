import type { H3Event } from 'h3'
import { fileTypeFromBuffer } from 'file-type'

export interface UploadRules {
  /** accepted MIME types (decided by the content) → file extension */
  accepted: Readonly<Record<string, string>>
  /** what to call the accepted types in a message, e.g. 'a PDF, PNG or JPEG' */
  acceptedWords: string
  maxBytes: number
  /** the form field that carries the file */
  field?: string
  /** false: a form without the file is fine (the result's file is null) */
  required?: boolean
}

export interface UploadedFile {
  bytes: Uint8Array
  mime: string
  extension: string
  filename: string
}

/**
 * Reads a multipart form and its one file, typed by its content (magic numbers), never by its name.
 * @throws 413 too large, 400 missing or empty, 415 a type not accepted — each naming the field.
 */
export async function readUpload(event: H3Event, rules: UploadRules): Promise<{ file: UploadedFile | null, fields: Record<string, string> }> {
  const field = rules.field ?? 'file'
  const limit = `larger than the ${rules.maxBytes / 1024 / 1024} MB limit`
  const declared = Number(getRequestHeader(event, 'content-length') ?? 0)
  if (declared > rules.maxBytes + 64 * 1024) throw createError({ statusCode: 413, message: `${field}: ${limit}`, data: { fields: { [field]: 'Too large' } } })
  const parts = await readMultipartFormData(event) ?? []
  const fields = Object.fromEntries(parts.filter(p => p.filename === undefined && p.name).map(p => [p.name!, p.data.toString('utf8')]))
  const part = parts.find(p => p.name === field && p.filename !== undefined && (p.data.length > 0 || rules.required !== false))
  if (!part) {
    if (rules.required === false) return { file: null, fields }
    throw createError({ statusCode: 400, message: `${field}: choose a file to upload`, data: { fields: { [field]: 'Choose a file' } } })
  }
  if (part.data.length === 0) throw createError({ statusCode: 400, message: `${field}: the file is empty`, data: { fields: { [field]: 'Empty file' } } })
  if (part.data.length > rules.maxBytes) throw createError({ statusCode: 413, message: `${field}: ${limit}`, data: { fields: { [field]: 'Too large' } } })
  // a file cut short after its signature (a PNG of 8 bytes) makes the type reader run off its end
  const detected = await fileTypeFromBuffer(part.data).catch(() => undefined)
  const extension = detected ? rules.accepted[detected.mime] : undefined
  if (!detected || !extension) {
    throw createError({ statusCode: 415, message: `${field}: its content is ${detected ? detected.mime : 'not a recognised type'}; upload ${rules.acceptedWords}`, data: { fields: { [field]: `Only ${rules.acceptedWords}` } } })
  }
  return { file: { bytes: new Uint8Array(part.data), mime: detected.mime, extension, filename: part.filename ?? '' }, fields }
}

/** Other spellings of a detected type's extension that a name may keep. */
const SAME_TYPE: Readonly<Record<string, readonly string[]>> = { jpg: ['jpg', 'jpeg'], png: ['png'], pdf: ['pdf'] }

/**
 * The name an upload is stored and shown under: the base name of what the browser sent, with only
 * the real extension of its detected type. Every extension-like ending is taken off
 * (`report.pdf.html` sent as a PDF → `report.pdf`), so a name never claims another type.
 */
export function storedFileName(sent: string, extension: string, fallback: string) {
  const base = (sent.split(/[\\/]/).pop() ?? '').replace(/[^\p{L}\p{N} ._()-]+/gu, '_').trim()
  const own = /\.([A-Za-z0-9]{1,8})$/.exec(base)?.[1]
  const keep = own && (SAME_TYPE[extension] ?? [extension]).includes(own.toLowerCase()) ? own : extension
  let stem = base
  while (/\.[A-Za-z][A-Za-z0-9]{0,7}$/.test(stem)) stem = stem.replace(/\.[A-Za-z][A-Za-z0-9]{0,7}$/, '')
  stem = stem.replace(/[. ]+$/, '').slice(0, 190) || fallback
  return `${stem}.${keep}`
}
