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

  it('merges a patch deeply, replacing arrays', () => {
    expect(mergePatch(data, { loads: { sdl: 0.003 }, spans: [1] })).toEqual({ loads: { sdl: 0.003, imposed: { qk: 0.005 } }, spans: [1] })
  })

  it('lists leaf paths', () => {
    expect(leafPaths(data)).toEqual(['loads.sdl', 'loads.imposed.qk', 'spans.0', 'spans.1'])
  })
})
