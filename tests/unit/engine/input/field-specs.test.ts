import { describe, expect, it } from 'vitest'
import { inputFieldSpecs } from '../../../../shared/engine/input/field-specs'
import type { InputFieldSpec } from '../../../../shared/engine/input/field-specs'

/** Every field, a table's columns included. */
function everyField(): InputFieldSpec[] {
  return inputFieldSpecs().flatMap(f => [f, ...(f.columns ?? [])])
}

describe('input field specs', () => {
  it('write Greek symbols as TeX commands, so the sheet typesets ψ0 and not "psi0"', () => {
    const greek = /(?<!\\)\b(alpha|beta|gamma|delta|epsilon|lambda|mu|xi|rho|sigma|phi|psi)(?=_|\b)/i
    for (const f of everyField()) {
      if (f.spec.symbol !== undefined) expect(f.spec.symbol, f.path).not.toMatch(greek)
    }
  })

  it('give each ψ factor of an added load its meaning in words', () => {
    const points = inputFieldSpecs().find(f => f.path === 'loads.points')!
    expect(points.columns!.filter(c => /^psi\d$/.test(c.path)).map(c => c.spec.label)).toEqual(['ψ0 (combination value)', 'ψ1 (frequent value)', 'ψ2 (quasi-permanent value)'])
  })
})
