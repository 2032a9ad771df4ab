import { deflateSync } from 'node:zlib'
import { PDFDocument } from 'pdf-lib'
import { describe, expect, it } from 'vitest'
import { sha256Hex } from '../../server/utils/hashing'
import { countRows } from '../helpers/db'
import { makeSheet, session } from './records-fixtures'

// CRC-32 (ISO 3309 / PNG spec §5.5), for a minimal valid PNG made here rather than copied in
function crc32(bytes: Uint8Array) {
  let c = ~0
  for (const b of bytes) {
    c ^= b
    for (let k = 0; k < 8; k++) c = (c >>> 1) ^ (0xEDB88320 & -(c & 1))
  }
  return ~c >>> 0
}

function png(width: number, height: number) {
  const chunk = (type: string, data: Uint8Array) => {
    const body = Buffer.concat([Buffer.from(type, 'ascii'), data])
    const out = Buffer.alloc(12 + data.length)
    out.writeUInt32BE(data.length, 0)
    body.copy(out, 4)
    out.writeUInt32BE(crc32(body), 8 + data.length)
    return out
  }
  const ihdr = Buffer.alloc(13)
  ihdr.writeUInt32BE(width, 0)
  ihdr.writeUInt32BE(height, 4)
  ihdr.set([8, 2, 0, 0, 0], 8)
  const raw = Buffer.alloc((width * 3 + 1) * height, 0x7f)
  for (let y = 0; y < height; y++) raw[y * (width * 3 + 1)] = 0
  return new Uint8Array(Buffer.concat([Buffer.from([0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A]), chunk('IHDR', ihdr), chunk('IDAT', deflateSync(raw)), chunk('IEND', new Uint8Array())]))
}

describe('attachments', () => {
  it('stores a PNG and a PDF by content type, hashed, listed and downloadable byte for byte', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
    const image = png(4, 3)
    const doc = await PDFDocument.create()
    doc.addPage([595.28, 841.89])
    const pdf = await doc.save()
    // the name says .txt: the content decides the type
    const a = await engineer.upload(`/api/sheets/${sheetId}/attachments`, image, 'site-photo.txt')
    expect(a.status).toBe(201)
    expect(a.body).toMatchObject({ mime: 'image/png', sha256: sha256Hex(image), filename: 'site-photo.txt' })
    const b = await engineer.upload(`/api/sheets/${sheetId}/attachments`, pdf, '../../etc/stressing record.pdf')
    expect(b.status).toBe(201)
    expect(b.body).toMatchObject({ mime: 'application/pdf', filename: 'stressing record.pdf' })
    const list = await engineer.json('GET', `/api/sheets/${sheetId}/attachments`)
    expect(list.body.map((x: { id: number }) => x.id)).toEqual([b.body.id, a.body.id])
    const res = await engineer.fetch(`/api/attachments/${a.body.id}`)
    expect(res.headers.get('content-type')).toBe('image/png')
    expect(res.headers.get('x-content-type-options')).toBe('nosniff')
    expect(sha256Hex(new Uint8Array(await res.arrayBuffer()))).toBe(sha256Hex(image))
  })

  it('refuses other content whatever its name, empty files and files over the limit', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
        const html = new TextEncoder().encode('<html><script>alert(1)</script></html>')
    const refused = await engineer.upload(`/api/sheets/${sheetId}/attachments`, html, 'drawing.png', 'image/png')
    expect(refused.status).toBe(415)
    expect(refused.body.message).toContain('PDF, PNG or JPEG')
    expect((await engineer.upload(`/api/sheets/${sheetId}/attachments`, new Uint8Array(), 'empty.pdf')).status).toBe(400)
    const big = new Uint8Array(10 * 1024 * 1024 + 1)
    big.set(png(1, 1))
    expect((await engineer.upload(`/api/sheets/${sheetId}/attachments`, big, 'big.png')).status).toBe(413)
    expect(await countRows('attachments', 'sheet_id = ?', [sheetId])).toBe(0)
    const records = await session('records')
    expect((await records.upload(`/api/sheets/${sheetId}/attachments`, png(1, 1), 'x.png')).status).toBe(403)
  })
})
