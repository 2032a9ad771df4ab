/**
 * Every input field with its label, unit, decimals, group and clause, read from the schema's
 * `.meta()`: the editor builds its form from this list and the report cites inputs by it.
 */
import { z } from 'zod'
import type { QuantitySpec } from '../contract'
import { memberInputSchema } from './schema'
import type { FieldMeta } from './schema'

export interface InputFieldSpec {
  path: string
  spec: QuantitySpec & { group: string; help?: string }
  /** 'table': a list of rows, each with the fields in `columns` (paths relative to the row) */
  kind: 'number' | 'enum' | 'array' | 'table'
  options?: string[]
  columns?: InputFieldSpec[]
  /** a table's new row: each column's default, or its least sensible value */
  emptyRow?: Record<string, unknown>
}

interface ZodDefLike {
  type: string
  innerType?: z.ZodType
  element?: z.ZodType
  shape?: Record<string, z.ZodType>
  entries?: Record<string, string>
  in?: z.ZodType
}

function defOf(schema: z.ZodType): ZodDefLike {
  return (schema as unknown as { _zod: { def: ZodDefLike } })._zod.def
}

function metaOf(schema: z.ZodType): FieldMeta | undefined {
  let s: z.ZodType | undefined = schema
  while (s) {
    const m = z.globalRegistry.get(s) as FieldMeta | undefined
    if (m && m.label) return m
    const d = defOf(s)
    s = d.type === 'default' || d.type === 'optional' || d.type === 'nullable' || d.type === 'prefault' ? d.innerType : d.type === 'pipe' ? d.in : undefined
  }
  return undefined
}

function unwrap(schema: z.ZodType): z.ZodType {
  let s = schema
  for (;;) {
    const d = defOf(s)
    if ((d.type === 'default' || d.type === 'optional' || d.type === 'nullable' || d.type === 'prefault') && d.innerType) s = d.innerType
    else if (d.type === 'pipe' && d.in) s = d.in
    else return s
  }
}

function toSpec(m: FieldMeta): InputFieldSpec['spec'] {
  const spec: InputFieldSpec['spec'] = { label: m.label, unit: m.unit, precision: m.precision, group: m.group }
  if (m.symbol !== undefined) spec.symbol = m.symbol
  if (m.clause !== undefined) spec.clause = m.clause
  if (m.help !== undefined) spec.help = m.help
  return spec
}

/** A new row's values where the column's least value would be refused: a joint sits over an interior support, the first is 2. */
const ROW_DEFAULTS: Record<string, Record<string, unknown>> = {
  'tendon.joints': { support: 2 },
}

function walk(schema: z.ZodType, path: string, out: InputFieldSpec[]): void {
  const inner = unwrap(schema)
  const d = defOf(inner)
  if (d.type === 'object' && d.shape) {
    for (const [k, v] of Object.entries(d.shape)) walk(v, path ? `${path}.${k}` : k, out)
    return
  }
  const m = metaOf(schema)
  if (!m) throw new Error(`input field ${path} has no metadata`)
  if (d.type === 'number') out.push({ path, spec: toSpec(m), kind: 'number' })
  else if (d.type === 'enum' && d.entries) out.push({ path, spec: toSpec(m), kind: 'enum', options: Object.values(d.entries) })
  else if (d.type === 'array' && d.element) {
    const el = unwrap(d.element)
    const ed = defOf(el)
    if (ed.type === 'object' && ed.shape) {
      const columns: InputFieldSpec[] = []
      for (const [k, v] of Object.entries(ed.shape)) walk(v, k, columns)
      const emptyRow = { ...Object.fromEntries(Object.entries(ed.shape).map(([k, v]) => [k, defaultOf(v, columns.find((c) => c.path === k))]).filter(([, v]) => v !== undefined)), ...ROW_DEFAULTS[path] }
      out.push({ path, spec: toSpec(m), kind: 'table', columns, emptyRow })
      return
    }
    const em = metaOf(d.element) ?? m
    const spec = toSpec({ ...em, label: m.label })
    out.push(ed.type === 'enum' && ed.entries ? { path, spec, kind: 'array', options: Object.values(ed.entries) } : { path, spec, kind: 'array' })
  } else throw new Error(`input field ${path} has an unsupported type ${d.type}`)
}

/** A column's default for a new row: the schema's default, else its first option, else the least non-negative value it takes (1 m for a length). */
function defaultOf(schema: z.ZodType, column: InputFieldSpec | undefined): unknown {
  const d = defOf(schema) as ZodDefLike & { defaultValue?: unknown }
  if (d.type === 'default') return typeof d.defaultValue === 'function' ? (d.defaultValue as () => unknown)() : d.defaultValue
  if (d.type === 'optional') return undefined // left out: the engine's own default applies
  if (column?.kind === 'enum') return column.options?.[0]
  const inner = unwrap(schema)
  const min = (inner as unknown as { minValue?: number | null }).minValue
  const candidates = [Math.max(0, typeof min === 'number' && Number.isFinite(min) ? min : 0), column?.spec.unit === 'm' ? 1000 : 1]
  return candidates.find((v) => inner.safeParse(v).success) ?? 0
}

/** Every input field with its label, unit, precision and group, in form order. */
export function inputFieldSpecs(): InputFieldSpec[] {
  const out: InputFieldSpec[] = []
  walk(memberInputSchema, '', out)
  return out
}
