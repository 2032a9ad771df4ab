import { describe, expect, it } from 'vitest'
import { reinforcementLimits } from '../../../../shared/engine/uls/reinforcement'
import { controlPerimeters, punchingCheck } from '../../../../shared/engine/uls/punching'
import { fieldOf } from '../../../helpers/engine'

describe('punching at a column head (EN 1992-1-1 6.4)', () => {
  it('control perimeters of Fig. 6.13 and 6.15', () => {
    expect(controlPerimeters('interior', 400, 400, 220).u1).toBeCloseTo(1600 + 4 * Math.PI * 220, 9)
    expect(controlPerimeters('edge', 400, 300, 220).u1).toBeCloseTo(300 + 800 + 2 * Math.PI * 220, 9)
    expect(controlPerimeters('corner', 400, 400, 220)).toEqual({ u0: 660, u1: 800 + Math.PI * 220 })
  })

  it('an interior column by hand, with the tendon component and σcp', () => {
    const r = punchingCheck({ VEd: 600e3, Vpd: 50e3, position: 'interior', c1: 400, c2: 400, d: 220, fck: 32, rhoLy: 0.005, rhoLz: 0.005, sigmaCy: 1.5, sigmaCz: 1.5 })
    expect(r.beta).toBe(1.15) // Fig. 6.21N
    expect(r.vEdU1).toBeCloseTo((1.15 * 550e3) / (4364.6 * 220), 3) // eq. (6.38): 0.659 MPa
    // eq. (6.47): 0.12·1.9535·(100·0.005·32)^(1/3) + 0.1·1.5 = 0.7407 MPa
    expect(r.vRdc).toBeCloseTo(0.7407, 3)
    // 6.4.5(3): 0.4·0.6(1 − 32/250)·32/1.5 = 4.465 MPa (A1:2014 recommended 0.4)
    expect(r.vRdMax).toBeCloseTo(4.4646, 3)
    expect(r.vEdU0).toBeCloseTo((1.15 * 600e3) / (1600 * 220), 9)
    expect(r.reinforcementNeeded).toBe(false)
  })

  it('bad input names the field', () => {
    const ok = { VEd: 600e3, Vpd: 0, position: 'interior' as const, c1: 400, c2: 400, d: 220, fck: 32, rhoLy: 0.005, rhoLz: 0.005, sigmaCy: 1, sigmaCz: 1 }
    expect(fieldOf(() => punchingCheck({ ...ok, c1: 0 }))).toBe('c1')
    expect(fieldOf(() => punchingCheck({ ...ok, beta: 3 }))).toBe('beta')
    expect(fieldOf(() => reinforcementLimits({ member: 'slab', fctm: 3, fyk: 900, bt: 1000, d: 220, h: 260, Ac: 1 }))).toBe('fyk')
  })
})
