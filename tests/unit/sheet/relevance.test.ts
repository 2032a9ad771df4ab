import { describe, expect, it } from 'vitest'
import { isRelevant, withoutHiddenValues } from '../../../shared/sheet/relevance'
import { DEMO_PS2 } from '../../../shared/engine/input/demo'

describe('fields shown for the member as set up', () => {
  it('the columns\' details only once columns are chosen; the far end only for a column that exists', () => {
    expect(isRelevant('columns.where', {})).toBe(true)
    expect(isRelevant('columns.c1', {})).toBe(false)
    expect(isRelevant('columns.c1', { columns: { where: 'all' } })).toBe(true)
    expect(isRelevant('columns.farEndAbove', { columns: { where: 'all' } })).toBe(false)
    expect(isRelevant('columns.farEndAbove', { columns: { where: 'all', heightAbove: 3000 } })).toBe(true)
    expect(isRelevant('columns.panelWidth', { section: { kind: 'tee-beam' }, columns: { where: 'all' } })).toBe(false)
  })

  it('the fire details only with a rating; the span ratio only for a two-way slab strip', () => {
    expect(isRelevant('fire.rating', {})).toBe(true)
    expect(isRelevant('fire.slab', { section: { kind: 'slab-strip' } })).toBe(false)
    expect(isRelevant('fire.slab', { section: { kind: 'slab-strip' }, fire: { rating: 'R90' } })).toBe(true)
    expect(isRelevant('fire.spanRatio', { section: { kind: 'slab-strip' }, fire: { rating: 'R90', slab: 'two-way' } })).toBe(true)
    expect(isRelevant('fire.spanRatio', { section: { kind: 'slab-strip' }, fire: { rating: 'R90' } })).toBe(false)
  })
})

describe('values of a mode not chosen', () => {
  it('drops the hand-set eccentricities once the profile is as deep as cover allows, and keeps them for a custom profile', () => {
    const custom = { ...DEMO_PS2, profile: { ...DEMO_PS2.profile, mode: 'custom', supportEcc: [0, 80, 80, 80, 0], spanEcc: [90, 90, 90, 90] } }
    expect(withoutHiddenValues(custom)).toBe(custom)
    const deepest = { ...custom, profile: { ...custom.profile, mode: 'deepest' } }
    const pruned = withoutHiddenValues(deepest)
    expect(pruned.profile).toEqual({ ...DEMO_PS2.profile, mode: 'deepest' })
    // nothing else changes, and the inputs given are not altered
    expect({ ...pruned, profile: undefined }).toEqual({ ...deepest, profile: undefined })
    expect(deepest.profile.supportEcc).toEqual([0, 80, 80, 80, 0])
  })

  it('drops a rectangle\'s width from a slab strip, but keeps a hidden field that has a default', () => {
    const slab = { ...DEMO_PS2, section: { ...DEMO_PS2.section, b: 1200 }, tendon: { ...DEMO_PS2.tendon, count: 4 } }
    const pruned = withoutHiddenValues(slab)
    expect(pruned.section).not.toHaveProperty('b')
    expect(pruned.tendon.count).toBe(4)
  })
})
