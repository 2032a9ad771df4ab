// Stored files (sealed PDFs, attachments) go through Nitro storage under the 'records' mount
// (server/plugins/records-storage.ts: fs driver locally, S3 when configured).
import { randomUUID } from 'node:crypto'

function store() {
  return useStorage('records')
}

export async function writeStored(key: string, bytes: Uint8Array) {
  await store().setItemRaw(key, Buffer.from(bytes))
}

/** The stored bytes, or null when the key holds nothing. */
export async function readStored(key: string): Promise<Uint8Array | null> {
  const value: unknown = await store().getItemRaw(key)
  if (value == null) return null
  if (value instanceof Uint8Array) return value
  if (value instanceof ArrayBuffer) return new Uint8Array(value)
  if (typeof value === 'string') return Buffer.from(value, 'binary')
  throw new Error(`storage returned an unexpected value for ${key}`)
}

/** A key no client chose: a folder for the kind of file and a random name (the original name is kept in the row). */
export function generatedKey(folder: string, extension: string) {
  return `${folder}:${randomUUID()}.${extension}`
}
