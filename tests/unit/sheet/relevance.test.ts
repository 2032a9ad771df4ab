import { describe, expect, it } from 'vitest'
import { isRelevant } from '../../../shared/sheet/relevance'

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
