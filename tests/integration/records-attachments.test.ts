import { PDFDocument } from 'pdf-lib'
import { describe, expect, it } from 'vitest'
import { sha256Hex } from '../../server/utils/hashing'
import { countRows } from '../helpers/db'
import { makeSheet, session } from './records-fixtures'
import { png } from '../helpers/png'

describe('attachments', () => {
  it('stores a PNG and a PDF by content type, hashed, listed and downloadable byte for byte', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
    const image = png(4, 3)
    const doc = await PDFDocument.create()
    doc.addPage([595.28, 841.89])
    const pdf = await doc.save()
    // the name says .txt: the content decides the type, and the stored name takes its extension
    const a = await engineer.upload(`/api/sheets/${sheetId}/attachments`, image, 'site-photo.txt')
    expect(a.status).toBe(201)
    expect(a.body).toMatchObject({ mime: 'image/png', sha256: sha256Hex(image), filename: 'site-photo.png' })
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
