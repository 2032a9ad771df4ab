import { describe, expect, it } from 'vitest'
import { DEMO_PS2, designMember, type CheckResult } from '../../../shared/engine/index'
import { checkHeadline, isControlledByDesign } from '../../../shared/sheet/headline'

const check = (id: string, utilisation: number, pass = utilisation <= 1): CheckResult =>
  ({ id, group: id.split('.')[0]!, title: id, clause: '', actual: utilisation, limit: 1, unit: '', utilisation, pass })

describe('the headline of the check summary', () => {
  it('never lets a fixed input govern: jacking at 100 % of σp,max reads 100 % by definition', () => {
    const { governing, highest } = checkHeadline([check('tendon.jacking', 1), check('tendon.coverBond', 1), check('frequent.top.S2', 0.8), check('uls.bending.S1', 0.7), check('sls.deflection.S1', 0.2), check('detailing.minSteel', 0.5)])
    expect(governing?.id).toBe('frequent.top.S2')
    expect(highest.map(c => c.id)).toEqual(['frequent.top.S2', 'uls.bending.S1', 'detailing.minSteel'])
  })

  it('puts a failing check first, even below a higher passing one (a capped utilisation)', () => {
    const { governing } = checkHeadline([check('uls.bending.S1', 0.95), check('precompression.min', 0.9, false)])
    expect(governing?.id).toBe('precompression.min')
  })

  it('on the demo slab, governs by a check the design controls', () => {
    const design = designMember(DEMO_PS2, { proposal: false })
    const { governing, highest } = checkHeadline(design.checks)
    expect(governing && isControlledByDesign(governing)).toBe(true)
    expect(governing!.id.startsWith('tendon.jacking')).toBe(false)
    expect(highest).toHaveLength(3)
    expect(highest.every(isControlledByDesign)).toBe(true)
    const controlled = design.checks.filter(isControlledByDesign).map(c => c.utilisation).sort((a, b) => b - a)
    expect(highest.map(c => c.utilisation)).toEqual(controlled.slice(0, 3))
  })
})
