import { describe, expect, it } from 'vitest'
import { getPath, leafPaths, mergePatch, setPath } from '../../../shared/utils/paths'

describe('dot paths', () => {
  const data = { loads: { sdl: 0.002, imposed: { qk: 0.005 } }, spans: [7800, 9600] }

  it('reads and writes without touching the original', () => {
    expect(getPath(data, 'loads.imposed.qk')).toBe(0.005)
    expect(getPath(data, 'spans.1')).toBe(9600)
    expect(getPath(data, 'spans.5')).toBeUndefined()
    const next = setPath(data, 'spans.1', 9000)
    expect(next.spans).toEqual([7800, 9000])
    expect(data.spans).toEqual([7800, 9600])
    expect(setPath({}, 'a.0.b', 1)).toEqual({ a: [{ b: 1 }] })
  })

  it('copies only what lies on the path: the rest keeps its identity', () => {
    const next = setPath(data, 'loads.imposed.qk', 0.004)
    expect(next.spans).toBe(data.spans)
    expect(next.loads).not.toBe(data.loads)
    expect(next.loads.imposed).not.toBe(data.loads.imposed)
    expect(data.loads.imposed.qk).toBe(0.005)
    const row = setPath({ rows: [{ a: 1 }, { a: 2 }] }, 'rows.1.a', 3)
    expect(row.rows).toEqual([{ a: 1 }, { a: 3 }])
    expect(Array.isArray(row.rows)).toBe(true)
  })

  it('merges a patch deeply, replacing arrays', () => {
    expect(mergePatch(data, { loads: { sdl: 0.003 }, spans: [1] })).toEqual({ loads: { sdl: 0.003, imposed: { qk: 0.005 } }, spans: [1] })
  })

  it('lists leaf paths', () => {
    expect(leafPaths(data)).toEqual(['loads.sdl', 'loads.imposed.qk', 'spans.0', 'spans.1'])
  })
})
