import { describe, expect, it } from 'vitest'
import { DEMO_PS2, designMember } from '../../../../shared/engine/index'
import { rel } from '../../../helpers/engine'

describe('SLS stage in the member design', () => {
  const d = designMember(DEMO_PS2, { proposal: false })

  it('long-term deflection of an uncracked member is (1 + φ) times the short-term one (EN 1992-1-1 eq. (7.20))', () => {
    for (const s of d.deflection.spans) {
      if (s.cracked) continue
      expect(rel(s.longTerm.down, (1 + d.deflection.phi) * s.shortTerm.down)).toBeLessThan(1e-9)
    }
  })
})
