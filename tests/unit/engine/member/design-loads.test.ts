import { describe, expect, it } from 'vitest'
import { DEMO_PS2, designMember } from '../../../../shared/engine/index'

describe('the design loads table (EN 1990 6.4.3, 6.5.3, Table A1.2(B) recommended factors)', () => {
  it('eq. (6.10): γG = 1.35 on the permanent loads, γQ = 1.5 on the imposed; ψ1 and ψ2 on the imposed only', () => {
    const d = designMember({ ...DEMO_PS2, uls: { combination: '6.10' } }, { proposal: false })
    const [sw, sdl, q] = d.designLoads
    expect(sw!.value).toBeCloseTo(d.loads.selfWeight, 12)
    expect(sw!.uls).toBeCloseTo(1.35 * d.loads.selfWeight, 12)
    expect(sdl!.frequent).toBeCloseTo(d.loads.superimposed, 12)
    expect(q!.uls).toBeCloseTo(1.5 * d.loads.imposed, 12)
    expect(q!.frequent).toBeCloseTo(d.input.loads.psi1 * d.loads.imposed, 12)
    expect(q!.quasiPermanent).toBeCloseTo(d.input.loads.psi2 * d.loads.imposed, 12)
  })

  it('eqs. (6.10a/b): the larger factor of the two, 1.35 (6.10a) on G and 1.5 (6.10b) on Q', () => {
    const d = designMember({ ...DEMO_PS2, uls: { combination: '6.10a/b' } }, { proposal: false })
    expect(d.designLoads[0]!.gammaUls).toBeCloseTo(1.35, 12) // max(1.35, ξ·1.35 = 1.1475)
    expect(d.designLoads[2]!.gammaUls).toBeCloseTo(1.5, 12) // max(ψ0·1.5 = 1.05, 1.5)
  })
})
