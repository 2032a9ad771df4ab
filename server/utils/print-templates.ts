// The title block repeated on every sheet of a printed revision and the footer with its hash,
// verification reference and caution. Chromium's header/footer templates take inline styles only.

import { CAUTION } from '../../shared/caution'

export { CAUTION }

export interface TitleBlock {
  /** the office's name and logo (a data: URL) in force at approval; '' and null before approval */
  office: string
  officeLogo: string | null
  projectName: string
  jobNumber: string
  client: string
  site: string
  sheetReference: string
  title: string
  partOfStructure: string
  revision: string
  status: string
  madeBy: string
  madeOn: string
  checkedBy: string
  checkedOn: string
  archiveRef: string
  contentHash: string
  verificationRef: string
}

export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, c => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', '\'': '&#39;' })[c]!)
}

/** yyyy-mm-dd in UTC: the same on every machine, so the printed bytes do not depend on where they were made. */
export function isoDay(date: Date | string | null | undefined): string {
  return date ? new Date(date).toISOString().slice(0, 10) : ''
}

const cell = 'border:0.6pt solid #1f2937;padding:1.2mm 1.8mm;vertical-align:top;'
const label = 'display:block;font-size:5.6pt;text-transform:uppercase;letter-spacing:0.04em;color:#4b5563;'
const value = 'display:block;font-size:8pt;color:#111827;'

function field(name: string, text: string, extra = '') {
  return `<td style="${cell}${extra}"><span style="${label}">${escapeHtml(name)}</span><span style="${value}">${escapeHtml(text) || '&nbsp;'}</span></td>`
}

/** The page's side margins: the title block, the body and the footer share them, so the body fills the frame. */
export const PAGE_MARGIN_MM = { top: 46, bottom: 22, side: 12 }

function officeCell(t: TitleBlock): string {
  const logo = t.officeLogo && /^data:image\/(png|jpeg);base64,[A-Za-z0-9+/=]+$/.test(t.officeLogo)
    ? `<img src="${t.officeLogo}" alt="" style="display:block;max-height:11mm;max-width:100%;margin:0 0 0.8mm;">`
    : ''
  return `<td rowspan="2" style="${cell}width:22%;vertical-align:middle;">${logo}<span style="${value}font-weight:bold;">${escapeHtml(t.office) || '&nbsp;'}</span></td>`
}

export function headerTemplate(t: TitleBlock): string {
  return `<div style="box-sizing:border-box;width:100%;padding:0 ${PAGE_MARGIN_MM.side}mm;font-family:'DejaVu Sans','Liberation Sans',sans-serif;-webkit-print-color-adjust:exact;">
<table style="width:100%;border-collapse:collapse;table-layout:fixed;">
<tr>${officeCell(t)}${field('Project', t.projectName, 'width:26%;')}${field('Job no.', t.jobNumber)}${field('Calc ref.', t.sheetReference)}${field('Revision', t.revision)}<td style="${cell}"><span style="${label}">Sheet</span><span style="${value}"><span class="pageNumber"></span> of <span class="totalPages"></span></span></td></tr>
<tr>${field('Title', t.title)}${field('Part of structure', t.partOfStructure, 'width:auto;')}${field('Status', t.status)}${field('Made by / date', `${t.madeBy} ${t.madeOn}`)}${field('Checked by / date', `${t.checkedBy} ${t.checkedOn}`)}</tr>
</table></div>`
}

/**
 * Where a sealed revision stands in the history log: its leaf, and the signed head it was sealed
 * under. Fixed at sealing (stored on the seal row), so a re-render prints the same.
 */
export interface LogStamp {
  leafIndex: number
  treeSize: number
  rootHash: string
}

/** The stamp as the PDF's keywords carry it, for the offline verifier to read back. */
export function logStampKeywords(stamp: LogStamp): string[] {
  return [`log-leaf:${stamp.leafIndex}`, `log-head:${stamp.treeSize}:${stamp.rootHash}`]
}

export function footerTemplate(t: TitleBlock, stamp?: LogStamp): string {
  const log = stamp ? `<div>History log leaf ${stamp.leafIndex} · sealed under signed head size ${stamp.treeSize}, root ${escapeHtml(stamp.rootHash)}</div>\n` : ''
  return `<div style="box-sizing:border-box;width:100%;padding:0 ${PAGE_MARGIN_MM.side}mm;font-family:'DejaVu Sans','Liberation Sans',sans-serif;font-size:6.4pt;color:#374151;">
<div style="border-top:0.6pt solid #1f2937;padding-top:1.2mm;">Archive ${escapeHtml(t.archiveRef)} · verification ${escapeHtml(t.verificationRef)} · content SHA-256 ${escapeHtml(t.contentHash)}</div>
${log}<div style="margin-top:0.6mm;">${escapeHtml(CAUTION)}</div></div>`
}
