import { describe, expect, it } from 'vitest'
import { inputFieldSpecs } from '../../../shared/engine/index'
import { addRowLabel, describeInputError, describeInputErrors, inputLabel, optionLabel } from '../../../shared/sheet/labels'

describe('input paths in people\'s words', () => {
  it('numbers list elements from 1, as drawings do', () => {
    expect(inputLabel('geometry.spans.1')).toBe('Span 2')
    expect(inputLabel('inputs.geometry.spans.0')).toBe('Span 1')
    expect(inputLabel('geometry.supports.4')).toBe('Support 5')
    expect(inputLabel('profile.spanEcc.2')).toBe('Eccentricity at the low point of span 3')
  })

  it('takes a field\'s label from the engine\'s field specs', () => {
    expect(inputLabel('section.h')).toBe('Overall depth')
    expect(inputLabel('loads.superimposed')).toBe('Superimposed dead load')
  })

  it('gives every input field a label that is not a path, and tells every field of a group apart', () => {
    const specs = inputFieldSpecs()
    const labels = specs.map(f => inputLabel(f.path))
    for (const [i, label] of labels.entries()) expect(label, specs[i]!.path).not.toMatch(/^[a-z]+(\.[a-zA-Z0-9]+)+$/)
    for (const group of new Set(specs.map(f => f.spec.group))) {
      const inGroup = specs.filter(f => f.spec.group === group).map(f => inputLabel(f.path))
      expect(new Set(inGroup).size, group).toBe(inGroup.length)
    }
  })

  it('shows words for option ids, for every option of every drop-down', () => {
    expect(optionLabel('section.kind', 'slab-strip')).toBe('Slab strip')
    expect(optionLabel('section.kind', 'tee-beam')).toBe('T band beam')
    expect(optionLabel('loads.pattern', 'alternate-and-adjacent')).toBe('Alternate and adjacent spans')
    expect(optionLabel('geometry.supports.2', 'fixed')).toBe('Fixed')
    for (const field of inputFieldSpecs().filter(f => f.options)) {
      for (const option of field.options!) {
        const words = optionLabel(field.path, option)
        if (/^[A-Z]+\d/.test(option)) continue // C32/40, XC1: the trade writes class names as they are
        expect(words, `${field.path} ${option}`).not.toBe(option)
        expect(words).not.toMatch(/^[a-z0-9]+(-[a-z0-9]+)+$/)
      }
    }
  })

  it('leads a message with the label, once', () => {
    expect(describeInputError('geometry.spans.1', 'Each span must be longer than zero')).toBe('Span 2: Each span must be longer than zero')
    expect(describeInputError('geometry.spans.1', 'Span length: enter a number')).toBe('Span 2: enter a number')
    expect(describeInputError('section.h', 'Overall depth must be at least 100 mm')).toBe('Overall depth must be at least 100 mm')
    expect(describeInputErrors({ 'inputs.geometry.spans.0': 'A span must be at least 1 m', 'inputs.section.h': 'Overall depth: enter a number' }))
      .toBe('Span 1: A span must be at least 1 m; Overall depth: enter a number')
  })

  it('names the table rows a button adds, and the ψ factors of a load, in words', () => {
    expect(addRowLabel('loads.points')).toBe('Add a point load')
    expect(addRowLabel('loads.lines')).toBe('Add a line load')
    expect(addRowLabel('loads.partials')).toBe('Add a partial load')
    for (const table of inputFieldSpecs().filter(f => f.kind === 'table')) expect(addRowLabel(table.path), table.path).not.toMatch(/[a-z]+\.[a-z]+/)
    expect(inputLabel('loads.points.1.psi2')).toBe('Point load 2, ψ2 (quasi-permanent value)')
    expect(optionLabel('columns.where', 'interior')).toBe('At the interior supports')
  })
})
