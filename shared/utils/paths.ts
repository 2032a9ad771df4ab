/** Dot paths into plain JSON data: 'loads.sdl', 'spans.2'. */

export type Json = null | boolean | number | string | Json[] | { [key: string]: Json }

/** A deep copy of plain JSON data; works on reactive proxies too (structuredClone does not). */
export function clonePlain<T>(data: T): T {
  return data === undefined ? data : JSON.parse(JSON.stringify(data)) as T
}

export function getPath(data: unknown, path: string): unknown {
  let node: unknown = data
  for (const part of path.split('.')) {
    if (node === null || typeof node !== 'object') return undefined
    node = (node as Record<string, unknown>)[part]
  }
  return node
}

/**
 * A copy of `data` with `value` at `path`; intermediate objects/arrays are created as needed.
 * Only the objects along the path are copied: the rest is shared with `data`, so a list the change
 * does not touch keeps its identity (and what shows it need not be drawn again). Neither is changed.
 */
export function setPath<T>(data: T, path: string, value: unknown): T {
  const parts = path.split('.')
  const copyOf = (node: unknown, nextPart: string): Record<string, unknown> => {
    if (Array.isArray(node)) return [...node] as unknown as Record<string, unknown>
    if (node !== null && typeof node === 'object') return { ...(node as Record<string, unknown>) }
    return (/^\d+$/.test(nextPart) ? [] : {}) as Record<string, unknown>
  }
  const root = copyOf(data, parts[0]!)
  let node = root
  parts.forEach((part, i) => {
    if (i === parts.length - 1) {
      node[part] = value
      return
    }
    node[part] = copyOf(node[part], parts[i + 1]!)
    node = node[part] as Record<string, unknown>
  })
  return root as T
}

/** Deep merge of a partial patch into data (arrays are replaced, not merged). */
export function mergePatch<T>(data: T, patch: unknown): T {
  if (patch === null || typeof patch !== 'object' || Array.isArray(patch)) return clonePlain(patch) as T
  const out = (data !== null && typeof data === 'object' && !Array.isArray(data) ? clonePlain(data) : {}) as Record<string, unknown>
  for (const [key, value] of Object.entries(patch as Record<string, unknown>)) {
    out[key] = value !== null && typeof value === 'object' && !Array.isArray(value) ? mergePatch(out[key], value) : clonePlain(value)
  }
  return out as T
}

/** Every leaf path of plain data, arrays by index: { a: { b: 1 }, c: [2] } → ['a.b', 'c.0']. */
export function leafPaths(data: unknown, prefix = ''): string[] {
  if (data === null || typeof data !== 'object') return prefix ? [prefix] : []
  const entries = Array.isArray(data) ? data.map((v, i) => [String(i), v] as const) : Object.entries(data)
  return entries.flatMap(([k, v]) => leafPaths(v, prefix ? `${prefix}.${k}` : k))
}

/** The field a concrete path belongs to: the field itself, or an element of a list field ('spans.2'). */
export function fieldFor<F extends { path: string, kind: string }>(fields: readonly F[], path: string): F | undefined {
  return fields.find(f => f.path === path) ?? fields.find(f => f.kind === 'array' && path.startsWith(`${f.path}.`) && /^\d+$/.test(path.slice(f.path.length + 1)))
}
