// The reproducibility rewrite of a rendered PDF, and the reading of its named destinations: pure
// pdf-lib work, run in a worker thread in the built server (server/pdf-rewrite/worker.ts) and
// inline where there is no built worker (unit tests, the dev server).
import { PDFArray, PDFDict, PDFDocument, PDFHexString, PDFName, PDFRef, PDFString, type PDFObject } from 'pdf-lib'

/**
 * pdf-lib waits a macrotask (setTimeout 0, at least a millisecond in Node) after every 100 objects
 * it parses and every 50 it writes; a sealed sheet has thousands, so by default most of a rewrite
 * was spent waiting (load + save ~430 ms of an 1.1 MB demo sheet, ~130 ms at 500 per wait, same
 * bytes). 500 objects still hand the event loop back every 10–20 ms where it runs inline.
 */
const OBJECTS_PER_WAIT = 500

export interface FixedMetadata {
  title: string
  subject: string
  keywords: string[]
  /** creation and modification date written into the file */
  date: Date
  /** 32 hex digits for the trailer /ID */
  documentId: string
}

function textOf(obj: PDFObject | undefined): string | null {
  return obj instanceof PDFString || obj instanceof PDFHexString ? obj.decodeText() : null
}

/**
 * Chromium's tagged PDF names structure elements after DOM node ids ("node00000088"). Those ids are
 * handed out lazily, per renderer process, to whichever node is asked for one first — and some are
 * asked for while the page paints on screen, which depends on timing — so neither their numbers nor
 * their order can be trusted. Rename them s00000001… in the order the elements stand in the
 * structure tree (the document's own order), everywhere they occur (the elements' /ID, table cells'
 * /Headers), and rebuild the /IDTree name tree as one sorted leaf, dropping its old nodes.
 */
function normaliseStructureIds(doc: PDFDocument) {
  const ctx = doc.context
  const ID = PDFName.of('ID')
  const K = PDFName.of('K')
  const resolve = (obj: PDFObject | undefined) => (obj instanceof PDFRef ? ctx.lookup(obj) : obj)
  const root = resolve(doc.catalog.get(PDFName.of('StructTreeRoot')))
  if (!(root instanceof PDFDict)) return

  // structure order: depth-first through /K from the root, each element once
  const ordered: Array<{ name: string, ref: PDFRef | null }> = []
  const seen = new Set<PDFObject>()
  const walk = (obj: PDFObject | undefined, ref: PDFRef | null, depth: number) => {
    if (obj === undefined || depth > 256) return
    if (obj instanceof PDFRef) return walk(ctx.lookup(obj), obj, depth)
    if (obj instanceof PDFArray) {
      for (let i = 0; i < obj.size(); i++) walk(obj.get(i), null, depth + 1)
      return
    }
    if (!(obj instanceof PDFDict) || seen.has(obj)) return
    seen.add(obj)
    const name = textOf(obj.get(ID))
    if (name !== null) ordered.push({ name, ref })
    walk(obj.get(K), null, depth + 1)
  }
  walk(root.get(K), null, 0)
  // an element outside the tree (none expected) still gets a name that does not depend on the render
  const outside = new Set<string>()
  for (const [, obj] of ctx.enumerateIndirectObjects()) {
    const name = obj instanceof PDFDict && obj.get(PDFName.of('Type')) === PDFName.of('StructElem') ? textOf(obj.get(ID)) : null
    if (name !== null && !seen.has(obj)) outside.add(name)
  }
  if (!ordered.length && !outside.size) return

  const renamed = new Map<string, PDFString>()
  for (const name of [...ordered.map(o => o.name), ...[...outside].sort()]) {
    if (!renamed.has(name)) renamed.set(name, PDFString.of(`s${String(renamed.size + 1).padStart(8, '0')}`))
  }
  const visit = (obj: PDFObject, depth: number) => {
    if (depth > 64) return
    if (obj instanceof PDFDict) {
      for (const [key, value] of obj.entries()) {
        const next = renamed.get(textOf(value) ?? '')
        if (next) obj.set(key, next)
        else visit(value, depth + 1)
      }
    }
    else if (obj instanceof PDFArray) {
      for (let i = 0; i < obj.size(); i++) {
        const value = obj.get(i)
        const next = renamed.get(textOf(value) ?? '')
        if (next) obj.set(i, next)
        else visit(value, depth + 1)
      }
    }
  }
  const idTreeRef = root.get(PDFName.of('IDTree'))
  const treeNodes: PDFRef[] = []
  const collectTree = (obj: PDFObject | undefined, depth: number) => {
    if (!(obj instanceof PDFRef) || depth > 32) return
    treeNodes.push(obj)
    const node = ctx.lookup(obj)
    const kids = node instanceof PDFDict ? node.get(PDFName.of('Kids')) : undefined
    if (kids instanceof PDFArray) for (let i = 0; i < kids.size(); i++) collectTree(kids.get(i), depth + 1)
  }
  collectTree(idTreeRef, 0)
  for (const ref of treeNodes) ctx.delete(ref)
  for (const [, obj] of ctx.enumerateIndirectObjects()) visit(obj, 0)

  // the name tree again, as one leaf whose keys (s00000001…) are sorted because they follow the walk
  const names: PDFObject[] = []
  const listed = new Set<string>()
  for (const { name, ref } of ordered) {
    if (!ref || listed.has(name)) continue
    listed.add(name)
    names.push(renamed.get(name)!, ref)
  }
  if (names.length) root.set(PDFName.of('IDTree'), ctx.register(ctx.obj({ Names: names })))
  else root.delete(PDFName.of('IDTree'))
}

/**
 * Same revision, same bytes: Chromium's output differs between runs in its dates, its trailer /ID
 * and the ids of its structure elements, so the first two are set from the revision, the ids are
 * renumbered (pdf-lib, no object streams) and the rest is left alone.
 */
export async function reproducibleBytes(bytes: Uint8Array, meta: FixedMetadata, objectsPerWait = OBJECTS_PER_WAIT): Promise<{ bytes: Uint8Array, pages: number }> {
  const doc = await PDFDocument.load(bytes, { updateMetadata: false, parseSpeed: objectsPerWait })
  normaliseStructureIds(doc)
  doc.setTitle(meta.title)
  doc.setSubject(meta.subject)
  doc.setKeywords(meta.keywords)
  doc.setProducer('Tendonbook')
  doc.setCreator('Tendonbook')
  doc.setCreationDate(meta.date)
  doc.setModificationDate(meta.date)
  const id = PDFHexString.of(meta.documentId)
  doc.context.trailerInfo.ID = doc.context.obj([id, id])
  const out = await doc.save({ useObjectStreams: false, addDefaultPage: false, updateFieldAppearances: false, objectsPerTick: objectsPerWait })
  return { bytes: out, pages: doc.getPageCount() }
}

/**
 * The page (from 1) of each named destination of a PDF — Chromium writes one for every element a
 * link of the document points to, such as the section headings the contents list links to. Reads
 * the catalogue's /Dests dictionary and the /Names /Dests name tree, whichever the file has.
 */
export async function destinationPages(bytes: Uint8Array, objectsPerWait = OBJECTS_PER_WAIT): Promise<Map<string, number>> {
  const doc = await PDFDocument.load(bytes, { updateMetadata: false, parseSpeed: objectsPerWait })
  const ctx = doc.context
  const pageIndex = new Map(doc.getPages().map((p, i) => [p.ref.toString(), i + 1]))
  const out = new Map<string, number>()
  const record = (name: string, target: PDFObject | undefined) => {
    let dest = target ? ctx.lookup(target) : undefined
    if (dest instanceof PDFDict) dest = ctx.lookup(dest.get(PDFName.of('D')))
    if (!(dest instanceof PDFArray) || dest.size() === 0) return
    const page = pageIndex.get(dest.get(0).toString())
    if (page !== undefined && !out.has(name)) out.set(name, page)
  }
  const catalog = doc.catalog
  const dests = catalog.lookup(PDFName.of('Dests'))
  if (dests instanceof PDFDict) {
    for (const [key, value] of dests.entries()) record(key.decodeText(), value)
  }
  const walk = (node: PDFObject | undefined, depth: number) => {
    const dict = node ? ctx.lookup(node) : undefined
    if (!(dict instanceof PDFDict) || depth > 32) return
    const names = dict.lookup(PDFName.of('Names'))
    if (names instanceof PDFArray) {
      for (let i = 0; i + 1 < names.size(); i += 2) {
        const key = textOf(names.lookup(i))
        if (key !== null) record(key, names.get(i + 1))
      }
    }
    const kids = dict.lookup(PDFName.of('Kids'))
    if (kids instanceof PDFArray) for (let i = 0; i < kids.size(); i++) walk(kids.get(i), depth + 1)
  }
  const nameTree = catalog.lookup(PDFName.of('Names'))
  if (nameTree instanceof PDFDict) walk(nameTree.get(PDFName.of('Dests')), 0)
  return out
}
