import { defineStore } from 'pinia'
import { inputFieldSpecs, memberInputSchema } from '~/shared/engine/index'
import { fieldErrors, type FieldErrors } from '~/shared/utils/validation'
import { clonePlain, getPath, mergePatch, setPath } from '~/shared/utils/paths'
import { compileSheet } from '~/shared/sheet/runtime'
import { typesetCacheEntries } from '~/shared/report/typeset'
import { createLiveRunner, type LiveOutcome, type LiveReport, type LiveRequest, type LiveRunState } from '~/shared/sheet/live-run'
import { describeInputError, inputLabel } from '~/shared/sheet/labels'
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

/** The report as the editor shows it: a part keeps its object while its html is unchanged, so Vue leaves its DOM alone. */
export interface ShownReport extends Omit<LiveReport, 'parts'> {
  /** `firstHtml`: the html the part's element was made with (the page patches later html into it) */
  parts: Array<{ key: string, html: string, firstHtml: string, figuresBefore: number }>
}

const FIGURE_TAG = /<figure class="tb-figure"/g

function patchReport(before: ShownReport | null, next: LiveReport): ShownReport {
  const old = new Map(before?.parts.map(p => [p.key, p]))
  let figures = 0
  const parts = next.parts.map((p) => {
    const kept = old.get(p.key)
    const part = kept && kept.html === p.html && kept.figuresBefore === figures ? kept : { key: p.key, html: p.html, firstHtml: kept?.firstHtml ?? p.html, figuresBefore: figures }
    figures += p.html.match(FIGURE_TAG)?.length ?? 0
    return part
  })
  return { ...next, parts }
}

const SAVE_DELAY_MS = 800
const FULL_RUN_DELAY_MS = 350
const COALESCE_MS = 1200
/** An answer overtaken by a change already waiting for its worker is not shown, unless none was shown for this long. */
const OVERTAKEN_SHOWN_AFTER_MS = 250
const MAX_UNDO = 100

/**
 * The sheet being edited: inputs (engine units), the live run of the engine and the rendered
 * report, derived on every change in the browser; the draft is saved to the server in the
 * background with optimistic concurrency.
 */
export const useSheetStore = defineStore('sheet', () => {
  const sheet = ref<SheetPayload | null>(null)
  // replaced whole on every change, never changed in place: a shallow ref, so validation, the key
  // and the panel read plain objects (a deep proxy made each of their thousand reads a tracked one)
  const inputs = shallowRef<Record<string, unknown>>({})
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

  // Every change runs the engine without the proposal search (the costly part) in a worker, off the
  // main thread, so the keystroke paints first; the full run with the proposal follows when typing
  // pauses. The first run of a sheet is full and runs here (also on the server for the first paint).
  const inputKey = computed(() => JSON.stringify(inputs.value))
  const outcome = shallowRef<LiveOutcome | null>(null)
  const shownReport = shallowRef<ShownReport | null>(null)
  const designChecks = shallowRef<LiveOutcome['designChecks']>(null)
  const everRan = ref(false)

  const run = computed<LiveRunState | null>(() => (validation.value.ok ? outcome.value?.run ?? null : null))

  function apply(result: LiveOutcome) {
    outcome.value = result
    if (result.run?.ok) everRan.value = true
    if (result.designChecks) designChecks.value = result.designChecks
    if (result.report) showReport(result.report)
  }

  // A report shows as one update of the part list; the page patches each changed part's html into
  // its element a few parts per frame (composables/reportPartPatch.ts), so Vue renders once per report.
  function showReport(next: LiveReport) {
    shownReport.value = patchReport(shownReport.value, next)
  }

  let seq = 0
  // answers to requests from before the last load belong to another sheet (or an older version of it)
  let resetSeq = 0
  // the newest request whose answer is shown: an answer to an older one (the proposal run of inputs
  // typed over since) is dropped
  let shownSeq = 0
  let shownAt = 0
  const liveRequest = (proposal: boolean): LiveRequest => ({
    seq: ++seq,
    key: inputKey.value,
    inputs: validation.value.ok ? clonePlain(validation.value.value) : null,
    text: text.value,
    images: clonePlain(images.value),
    proposal,
  })

  /**
   * A worker that runs one request at a time: a change made while it is busy is sent when it is
   * free, as one request with the latest inputs. `answered` follows each answer it gives.
   */
  function runChannel(proposal: boolean, answered: () => void) {
    let worker: Worker | null = null
    let busy = false
    let again = false
    // the load this worker has not heard of yet (it starts when first needed)
    let unheardLoad: LiveRequest | null = null
    const start = () => {
      const w = new Worker(new URL('../workers/sheet-run.ts', import.meta.url), { type: 'module' })
      w.onmessage = (event: MessageEvent<LiveOutcome>) => {
        busy = false
        // a change typed while this ran is sent next: patching this answer into the page would be
        // undone some 60 ms later, so it is skipped — but a steady typist still sees a report now and then
        const overtaken = again && performance.now() - shownAt < OVERTAKEN_SHOWN_AFTER_MS
        if (event.data.seq >= resetSeq && event.data.seq > shownSeq && !overtaken) {
          shownSeq = event.data.seq
          shownAt = performance.now()
          apply(event.data)
        }
        if (again) {
          again = false
          post()
        }
        else {
          answered()
        }
      }
      return w
    }
    const tell = (first: LiveRequest) => {
      worker ??= start()
      worker.postMessage({ reset: { ...first, proposal: false }, formulas: typesetCacheEntries() })
      unheardLoad = null
    }
    const post = () => {
      if (unheardLoad) tell(unheardLoad)
      worker ??= start()
      busy = true
      worker.postMessage(liveRequest(proposal))
    }
    return {
      send() {
        if (busy) again = true
        else post()
      },
      /** a sheet (re)loaded: the worker forgets the last and takes the page's typeset formulas, now or when it starts */
      reset(first: LiveRequest, now: boolean) {
        again = false
        if (now || worker) tell(first)
        else unheardLoad = first
      },
    }
  }

  // Every change runs the engine without the proposal search in one worker; the run with the
  // proposal follows in another when typing pauses, so a keystroke never waits behind the search.
  let fullTimer: ReturnType<typeof setTimeout> | undefined
  const quickRuns = runChannel(false, scheduleFull)
  const fullRuns = runChannel(true, () => {})
  const signature = () => `${inputKey.value}\u0000${text.value}\u0000${JSON.stringify(images.value)}`
  let lastSent = ''
  function sendQuick() {
    if (!import.meta.client) return
    lastSent = signature()
    quickRuns.send()
  }
  function scheduleFull() {
    clearTimeout(fullTimer)
    fullTimer = setTimeout(() => {
      if (validation.value.ok && !(outcome.value?.full && outcome.value.key === inputKey.value)) fullRuns.send()
    }, FULL_RUN_DELAY_MS)
  }
  watch([inputKey, text, images], () => {
    if (signature() === lastSent) return
    clearTimeout(fullTimer)
    sendQuick()
  })

  // the proposal applies to the inputs it was worked out for, never to inputs typed since
  const proposal = computed(() => {
    const o = outcome.value
    if (!validation.value.ok || !o?.proposal) return null
    return o.key === inputKey.value ? o.proposal : { patch: null, reason: 'Working out the proposal…' }
  })

  // the same object while the messages are the same, so an engine answer that changes no message
  // does not render the input panel's fields again
  const errors = computed<FieldErrors>((previous) => {
    const out: FieldErrors = { ...validation.value.errors, ...typingErrors.value }
    if (run.value && !run.value.ok) out[run.value.field] = run.value.message
    const same = previous && Object.keys(previous).length === Object.keys(out).length && Object.entries(out).every(([path, message]) => previous[path] === message)
    return same ? previous : out
  })

  const blocker = computed<Blocker | null>(() => {
    const [path, message] = Object.entries(errors.value)[0] ?? []
    if (!path) return null
    // an engine failure that names no input (a bug, not a typing slip) is said as it is
    if (path === '(engine)') return { path, label: 'The design engine', message: `The design engine stopped: ${message}` }
    return { path, label: inputLabel(path), message: describeInputError(path, message!) }
  })

  // While a field is invalid the report of the last inputs that ran stays on screen, marked stale.
  const stale = computed(() => !(run.value?.ok) && everRan.value)
  const report = computed(() => shownReport.value)

  // the engine's checks and the engineer's own (the sheet's calculation blocks), as the report lists them
  const checks = computed(() => report.value?.checks ?? designChecks.value ?? [])

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
    // the first run is full and here: the page paints with its report (the server renders it too)
    outcome.value = null
    shownReport.value = null
    designChecks.value = null
    everRan.value = false
    const first = liveRequest(true)
    resetSeq = first.seq
    lastSent = signature()
    const loader = createLiveRunner()
    apply(loader.run(first))
    shownSeq = first.seq
    if (import.meta.client) {
      clearTimeout(fullTimer)
      quickRuns.reset(first, true)
      fullRuns.reset(first, false)
    }
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
    inputs.value = toRaw(entry.inputs)
    typingErrors.value = {}
    scheduleSave()
  }

  function redo() {
    const entry = redoStack.value.pop()
    if (!entry) return
    undoStack.value.push({ label: entry.label, inputs: clonePlain(inputs.value), at: Date.now() })
    inputs.value = toRaw(entry.inputs)
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
    sheet, inputs, draftVersion, saveState, saveMessage, savedAt, specs, compiled, validation, run, proposal, errors, blocker, stale, report,
    text, ownText, textErrors, setText, images, setImages,
    checks, undoStack, redoStack,
    replies, replyList, answerRevision, setReply, clearReplies,
    load, setInput, setTextError, resizeSpans, applyPatch, replaceInputs, undo, redo, save, flush,
  }
})
