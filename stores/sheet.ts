import { defineStore } from 'pinia'
import { inputFieldSpecs, memberInputSchema } from '~/shared/engine/index'
import { fieldErrors, type FieldErrors } from '~/shared/utils/validation'
import { clonePlain, getPath, mergePatch, setPath } from '~/shared/utils/paths'
import { runSheet, renderSheet, compileSheet, type SheetRun } from '~/shared/sheet/runtime'
import { describeInputError, inputLabel, optionLabel } from '~/shared/sheet/labels'
import { resizeSpanLists, spanCount } from '~/shared/sheet/spans'
import { CONFLICT_MARKERS } from '~/shared/sheet/text-merge'
import { withoutHiddenValues } from '~/shared/sheet/relevance'

/** 1-based lines where a merge left a conflict's opening marker. */
function conflictLines(text: string): number[] {
  return text.split('\n').flatMap((l, i) => (l === CONFLICT_MARKERS.mine ? [i + 1] : []))
}

export interface SheetPayload {
  id: number
  reference: string
  title: string
  partOfStructure: string
  inputs: Record<string, unknown>
  draftVersion: number
  updatedAt: string
  updatedByName: string
  createdByName: string
  newerTemplateVersion: number | null
  /** the sheet's own text, or null while it follows its template's text */
  body: string | null
  template: { id: number, slug: string, version: number, title: string, model: string, body: string }
  project: { id: number, jobNumber: string, name: string, client: string, site: string }
  /** the signed-in user's role on the sheet's project */
  yourRole: 'engineer' | 'checker' | 'records'
}

export type SaveState = 'saved' | 'pending' | 'saving' | 'invalid' | 'conflict' | 'error'

/** The first input that keeps the design from running, in people's words. */
export interface Blocker { path: string, label: string, message: string }

interface UndoEntry { label: string, inputs: Record<string, unknown>, path?: string, at: number }

const SAVE_DELAY_MS = 800
const FULL_RUN_DELAY_MS = 350
const COALESCE_MS = 1200
const MAX_UNDO = 100

/**
 * The sheet being edited: inputs (engine units), the live run of the engine and the rendered
 * report, derived on every change in the browser; the draft is saved to the server in the
 * background with optimistic concurrency.
 */
export const useSheetStore = defineStore('sheet', () => {
  const sheet = ref<SheetPayload | null>(null)
  const inputs = ref<Record<string, unknown>>({})
  const draftVersion = ref(0)
  const saveState = ref<SaveState>('saved')
  const saveMessage = ref('')
  const savedAt = ref<string | null>(null)
  const typingErrors = ref<FieldErrors>({})
  const undoStack = ref<UndoEntry[]>([])
  const redoStack = ref<UndoEntry[]>([])
  const specs = inputFieldSpecs()

  // The sheet's attached images by file name, for ::: figure{image=…} in its text
  const images = ref<Record<string, { src: string, sha256: string }>>({})
  function setImages(list: ReadonlyArray<{ id: number, filename: string, mime: string, sha256: string }>) {
    images.value = Object.fromEntries(list.filter(a => a.mime === 'image/png' || a.mime === 'image/jpeg').map(a => [a.filename, { src: `/api/attachments/${a.id}`, sha256: a.sha256 }]))
  }

  // The sheet's text: its own once the engineer edits it, else its template's. While the text has a
  // problem the report keeps the last text that loaded, and the problems are listed by line.
  const text = ref('')
  const ownText = computed(() => sheet.value !== null && text.value !== sheet.value.template.body)
  const compiledNow = computed(() => (sheet.value ? compileSheet(text.value) : null))
  const lastCompiled = shallowRef<ReturnType<typeof compileSheet> | null>(null)
  watch(compiledNow, (c) => {
    if (c?.ok) lastCompiled.value = c
  }, { immediate: true })
  const compiled = computed(() => (compiledNow.value?.ok ? compiledNow.value : lastCompiled.value ?? compiledNow.value))
  const textErrors = computed(() => [
    ...conflictLines(text.value).map(line => `line ${line}: a conflict with the newer template version: keep the lines you want between the markers and delete the markers`),
    ...(compiledNow.value && !compiledNow.value.ok ? compiledNow.value.errors : []),
  ])
  function setText(next: string) {
    if (next === text.value) return
    text.value = next
    scheduleSave()
  }

  const validation = computed(() => {
    const parsed = memberInputSchema.safeParse(inputs.value)
    return parsed.success ? { ok: true as const, value: parsed.data, errors: {} as FieldErrors } : { ok: false as const, errors: fieldErrors(parsed.error) }
  })

  // Every change runs the engine at once without the proposal search (the costly part); the full
  // run with the proposal follows when typing pauses. The first run of a sheet is always full.
  const fullRun = shallowRef<{ key: string, run: SheetRun } | null>(null)
  const inputKey = computed(() => JSON.stringify(inputs.value))
  let fullTimer: ReturnType<typeof setTimeout> | undefined
  const run = computed<SheetRun | null>(() => {
    if (!validation.value.ok) return null
    if (fullRun.value?.key === inputKey.value) return fullRun.value.run
    return runSheet(validation.value.value, { proposal: false })
  })
  watch(inputKey, (key) => {
    clearTimeout(fullTimer)
    if (!validation.value.ok || fullRun.value?.key === key) return
    const value = validation.value.value
    fullTimer = setTimeout(() => {
      if (inputKey.value === key) fullRun.value = { key, run: runSheet(value) }
    }, FULL_RUN_DELAY_MS)
  })

  const errors = computed<FieldErrors>(() => {
    const out: FieldErrors = { ...validation.value.errors, ...typingErrors.value }
    if (run.value && !run.value.ok) out[run.value.field] = run.value.message
    return out
  })

  const blocker = computed<Blocker | null>(() => {
    const [path, message] = Object.entries(errors.value)[0] ?? []
    if (!path) return null
    // an engine failure that names no input (a bug, not a typing slip) is said as it is
    if (path === '(engine)') return { path, label: 'The design engine', message: `The design engine stopped: ${message}` }
    return { path, label: inputLabel(path), message: describeInputError(path, message!) }
  })

  // The last inputs that ran: while a field is invalid the report stays on screen, marked stale.
  const lastGood = shallowRef<{ inputs: unknown, run: Extract<SheetRun, { ok: true }> } | null>(null)
  watch(run, (r) => {
    if (r?.ok && validation.value.ok) lastGood.value = { inputs: validation.value.value, run: r }
  }, { immediate: true })
  const stale = computed(() => !(run.value?.ok) && lastGood.value !== null)
  const shownRun = computed(() => (run.value?.ok ? run.value : lastGood.value?.run ?? null))

  const report = computed(() => {
    const c = compiled.value
    const r = shownRun.value
    if (!c || !c.ok || !r) return null
    const shownInputs = run.value?.ok && validation.value.ok ? validation.value.value : lastGood.value!.inputs
    return renderSheet(c.template, shownInputs, r.design, 'edit', { optionLabel, images: images.value })
  })

  // the engine's checks and the engineer's own (the sheet's calculation blocks), as the report lists them
  const checks = computed(() => report.value?.checks ?? shownRun.value?.design.checks ?? [])

  // Replies to the checker's comments on a returned revision, keyed "reviewId:index"; they go with
  // the next issue. Kept in the browser per revision, so a reload does not lose what is written.
  const replies = ref<Record<string, string>>({})
  const repliesTo = ref<number | null>(null)
  const replyStoreKey = (revisionId: number) => `tendonbook-replies-${revisionId}`
  function answerRevision(revisionId: number | null) {
    if (repliesTo.value === revisionId) return
    repliesTo.value = revisionId
    replies.value = revisionId === null ? {} : JSON.parse(localStorage.getItem(replyStoreKey(revisionId)) ?? '{}')
  }
  function setReply(reviewId: number, index: number, text: string) {
    replies.value = { ...replies.value, [`${reviewId}:${index}`]: text }
    if (repliesTo.value !== null) localStorage.setItem(replyStoreKey(repliesTo.value), JSON.stringify(replies.value))
  }
  const replyList = computed(() => Object.entries(replies.value).filter(([, text]) => text.trim()).map(([key, text]) => {
    const [reviewId, index] = key.split(':').map(Number) as [number, number]
    return { reviewId, index, text: text.trim() }
  }))
  /** The replies went with an issue: forget them. */
  function clearReplies() {
    if (repliesTo.value !== null) localStorage.removeItem(replyStoreKey(repliesTo.value))
    replies.value = {}
    repliesTo.value = null
  }

  function load(payload: SheetPayload) {
    sheet.value = payload
    text.value = payload.body ?? payload.template.body
    lastCompiled.value = null
    inputs.value = clonePlain(payload.inputs)
    fullRun.value = validation.value.ok ? { key: inputKey.value, run: runSheet(validation.value.value) } : null
    lastGood.value = null
    if (fullRun.value?.run.ok && validation.value.ok) lastGood.value = { inputs: validation.value.value, run: fullRun.value.run }
    draftVersion.value = payload.draftVersion
    saveState.value = 'saved'
    savedAt.value = payload.updatedAt
    typingErrors.value = {}
    undoStack.value = []
    redoStack.value = []
  }

  function remember(label: string, path?: string) {
    const last = undoStack.value.at(-1)
    const now = Date.now()
    // keystrokes in one field within a moment make one undo step
    if (last && path && last.path === path && now - last.at < COALESCE_MS) {
      last.at = now
      return
    }
    undoStack.value.push({ label, inputs: clonePlain(inputs.value), path, at: now })
    if (undoStack.value.length > MAX_UNDO) undoStack.value.shift()
    redoStack.value = []
  }

  /** Forgets the text errors of a field and of its list elements: a new value replaces that text. */
  function clearTextErrors(path: string) {
    typingErrors.value = Object.fromEntries(Object.entries(typingErrors.value).filter(([p]) => p !== path && !p.startsWith(`${path}.`)))
  }

  function setInput(path: string, value: unknown) {
    clearTextErrors(path)
    if (JSON.stringify(value) === JSON.stringify(getPath(inputs.value, path))) return
    remember(`Change ${inputLabel(path)}`, path)
    // a mode changed: its own values for the mode left are dropped, not kept hidden (undo restores them)
    inputs.value = withoutHiddenValues(setPath(inputs.value, path, value))
    scheduleSave()
  }

  /** A field's own text is not a number (message), or is one again (null). */
  function setTextError(path: string, message: string | null) {
    if (message === null) {
      if (!(path in typingErrors.value)) return
      const { [path]: _cleared, ...rest } = typingErrors.value
      typingErrors.value = rest
      return
    }
    typingErrors.value = { ...typingErrors.value, [path]: message }
  }

  /** Keeps the per-span and per-support lists in step with the number of spans. */
  function resizeSpans(count: number) {
    const current = spanCount(inputs.value)
    if (count < 1 || count > 10 || count === current) return
    remember(count > current ? 'Add a span' : 'Remove a span')
    clearTextErrors('geometry')
    clearTextErrors('profile')
    inputs.value = resizeSpanLists(inputs.value, count)
    scheduleSave()
  }

  /** Applies a partial input (e.g. the Magnel proposal) as one undoable step. */
  function applyPatch(label: string, patch: Record<string, unknown>) {
    remember(label)
    inputs.value = withoutHiddenValues(mergePatch(inputs.value, patch))
    scheduleSave()
  }

  function replaceInputs(label: string, next: Record<string, unknown>) {
    remember(label)
    inputs.value = clonePlain(next)
    typingErrors.value = {}
    scheduleSave()
  }

  function undo() {
    const entry = undoStack.value.pop()
    if (!entry) return
    redoStack.value.push({ label: entry.label, inputs: clonePlain(inputs.value), at: Date.now() })
    inputs.value = entry.inputs
    typingErrors.value = {}
    scheduleSave()
  }

  function redo() {
    const entry = redoStack.value.pop()
    if (!entry) return
    undoStack.value.push({ label: entry.label, inputs: clonePlain(inputs.value), at: Date.now() })
    inputs.value = entry.inputs
    scheduleSave()
  }

  let timer: ReturnType<typeof setTimeout> | undefined
  let inFlight: Promise<void> | null = null

  function scheduleSave() {
    if (saveState.value === 'conflict') return
    saveState.value = 'pending'
    clearTimeout(timer)
    timer = setTimeout(() => { void save() }, SAVE_DELAY_MS)
  }

  async function save() {
    if (!sheet.value || saveState.value === 'conflict') return
    if (inFlight) await inFlight
    if (Object.keys(typingErrors.value).length || !validation.value.ok) {
      saveState.value = 'invalid'
      saveMessage.value = `Not saved: ${blocker.value?.message ?? 'fix the marked fields'}`
      return
    }
    saveState.value = 'saving'
    const body = { inputs: clonePlain(inputs.value), draftVersion: draftVersion.value, body: ownText.value ? text.value : null }
    inFlight = (async () => {
      try {
        const res = await $fetch<{ draftVersion: number, savedAt: string }>(`/api/sheets/${sheet.value!.id}/draft`, { method: 'PUT', body })
        draftVersion.value = res.draftVersion
        savedAt.value = res.savedAt
        if (saveState.value === 'saving') saveState.value = 'saved'
        saveMessage.value = ''
      }
      catch (error) {
        const status = (error as { statusCode?: number }).statusCode
        saveState.value = status === 409 ? 'conflict' : 'error'
        saveMessage.value = apiErrorMessage(error)
      }
      finally {
        inFlight = null
      }
    })()
    await inFlight
  }

  // an error that goes away lets the waiting draft save: nothing stays "Not saved" once fixed
  watch(blocker, (now) => {
    if (saveState.value === 'invalid') {
      if (now) saveMessage.value = `Not saved: ${now.message}`
      else scheduleSave()
    }
  })

  /** Waits for any pending save (before issuing a revision, or leaving the page). */
  async function flush() {
    if (saveState.value === 'pending') {
      clearTimeout(timer)
      await save()
    }
    else if (inFlight) {
      await inFlight
    }
  }

  return {
    sheet, inputs, draftVersion, saveState, saveMessage, savedAt, specs, compiled, validation, run, errors, blocker, stale, report,
    text, ownText, textErrors, setText, images, setImages,
    checks, undoStack, redoStack,
    replies, replyList, answerRevision, setReply, clearReplies,
    load, setInput, setTextError, resizeSpans, applyPatch, replaceInputs, undo, redo, save, flush,
  }
})
