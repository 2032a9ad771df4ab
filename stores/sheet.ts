import { defineStore } from 'pinia'
import { memberInputSchema } from '~/shared/engine/input/schema'
import { inputFieldSpecs } from '~/shared/engine/input/field-specs'
import { fieldErrors, type FieldErrors } from '~/shared/utils/validation'
import { clonePlain, getPath, mergePatch, setPath } from '~/shared/utils/paths'
import { runSheet, renderSheet, compileSheet, type SheetRun } from '~/shared/sheet/runtime'

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
  template: { id: number, slug: string, version: number, title: string, model: string, body: string }
  project: { id: number, jobNumber: string, name: string, client: string, site: string }
}

export type SaveState = 'saved' | 'pending' | 'saving' | 'invalid' | 'conflict' | 'error'

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

  const compiled = computed(() => (sheet.value ? compileSheet(sheet.value.template.body) : null))

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

  const report = computed(() => {
    const c = compiled.value
    if (!c || !c.ok || !run.value || !run.value.ok) return null
    return renderSheet(c.template, validation.value.ok ? validation.value.value : inputs.value, run.value.design, 'edit')
  })

  const checks = computed(() => (run.value?.ok ? run.value.design.checks : []))

  function load(payload: SheetPayload) {
    sheet.value = payload
    inputs.value = clonePlain(payload.inputs)
    fullRun.value = validation.value.ok ? { key: inputKey.value, run: runSheet(validation.value.value) } : null
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

  function setInput(path: string, value: unknown) {
    if (getPath(inputs.value, path) === value) return
    const { [path]: _cleared, ...rest } = typingErrors.value
    typingErrors.value = rest
    remember(`Change ${path}`, path)
    inputs.value = setPath(inputs.value, path, value)
    scheduleSave()
  }

  function markInvalid(path: string, message: string) {
    typingErrors.value = { ...typingErrors.value, [path]: message }
    saveState.value = 'invalid'
    saveMessage.value = message
  }

  /** Keeps the per-span and per-support lists in step with the number of spans. */
  function resizeSpans(count: number) {
    const current = inputs.value
    const spans = [...((getPath(current, 'geometry.spans') as number[]) ?? [])]
    if (count < 1 || count > 10 || count === spans.length) return
    remember(count > spans.length ? 'Add a span' : 'Remove a span')
    const resize = <T>(list: T[] | undefined, n: number) => {
      if (!list) return undefined
      const out = list.slice(0, n)
      while (out.length < n) out.push(list[list.length - 1]!)
      return out
    }
    let next = setPath(current, 'geometry.spans', resize(spans, count))
    for (const [path, n] of [['geometry.supports', count + 1], ['profile.supportEcc', count + 1], ['profile.spanEcc', count], ['profile.lowPointAt', count]] as const) {
      const list = getPath(next, path) as unknown[] | undefined
      if (list) next = setPath(next, path, resize(list, n))
    }
    inputs.value = next
    scheduleSave()
  }

  /** Applies a partial input (e.g. the Magnel proposal) as one undoable step. */
  function applyPatch(label: string, patch: Record<string, unknown>) {
    remember(label)
    inputs.value = mergePatch(inputs.value, patch)
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
      const [field, message] = Object.entries(errors.value)[0] ?? ['', '']
      saveMessage.value = `Not saved: ${field ? `${field} — ` : ''}${message}`
      return
    }
    saveState.value = 'saving'
    const body = { inputs: clonePlain(inputs.value), draftVersion: draftVersion.value }
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
    sheet, inputs, draftVersion, saveState, saveMessage, savedAt, specs, compiled, validation, run, errors, report,
    checks, undoStack, redoStack,
    load, setInput, markInvalid, resizeSpans, applyPatch, replaceInputs, undo, redo, save, flush,
  }
})
