/**
 * The optional input groups of the ultimate limit state, deflection, cracking and the site schedules,
 * merged into memberInputSchema (schema.ts). Every leaf carries the same `.meta()` as the other
 * inputs; every group has defaults (recommended EN values, or common practice where marked) so an
 * input without these groups still parses. Engine units throughout (mm, N, MPa, fractions).
 */
import { z } from 'zod'
import type { DisplayUnit } from '../../utils/units'

export const PART2_GROUPS = ['uls', 'sls', 'site'] as const
type Group = (typeof PART2_GROUPS)[number]

type Meta = {
  label: string
  unit: DisplayUnit
  precision: number
  group: Group
  symbol?: string
  help?: string
  clause?: string
}

function num(m: Meta, min: number, max: number, msg?: string): z.ZodNumber {
  return z.number({ error: `${m.label}: enter a number` })
    .min(min, msg ?? `${m.label} must be at least ${min}`)
    .max(max, msg ?? `${m.label} must not exceed ${max}`)
    .meta(m)
}

// the return type is left to inference so that the parsed input keeps its shape
function bars(where: 'bottom' | 'top') {
  const side = where === 'bottom' ? 'Bottom' : 'Top'
  return z.object({
    area: num({ label: `${side} bars, area in the width designed`, unit: 'mm²', precision: 0, group: 'uls', symbol: where === 'bottom' ? 'A_{s,bot}' : 'A_{s,top}', help: 'per metre for a slab strip; 0 for none' }, 0, 1e6, `${side} bar area must lie between 0 and 1 000 000 mm²`).default(0),
    diameter: num({ label: `${side} bar diameter`, unit: 'mm', precision: 0, group: 'uls', symbol: '\\phi' }, 6, 50, 'A bar diameter lies between 6 and 50 mm').default(12),
    cover: num({ label: `${side} cover to the bars`, unit: 'mm', precision: 0, group: 'uls', symbol: 'c', clause: 'EN 1992-1-1 4.4.1' }, 10, 150, 'The cover must lie between 10 and 150 mm').default(30),
  }).prefault({})
}

export const part2InputShape = {
  uls: z.object({
    combination: z.enum(['6.10', '6.10a/b']).default('6.10')
      .meta({ label: 'Fundamental combination', unit: '', precision: 0, group: 'uls', clause: 'EN 1990 6.4.3.2', help: 'eq. (6.10), or the less favourable of eqs. (6.10a) and (6.10b)' }),
    gammaG: num({ label: 'γG,sup (permanent, unfavourable)', unit: '', precision: 2, group: 'uls', symbol: '\\gamma_G', clause: 'EN 1990 Table A1.2(B)' }, 1, 2).default(1.35),
    gammaQ: num({ label: 'γQ (imposed)', unit: '', precision: 2, group: 'uls', symbol: '\\gamma_Q', clause: 'EN 1990 Table A1.2(B)' }, 1, 2).default(1.5),
    xi: num({ label: 'ξ of eq. (6.10b)', unit: '', precision: 2, group: 'uls', symbol: '\\xi', clause: 'EN 1990 Table A1.2(B)' }, 0.5, 1).default(0.85),
    gammaP: num({ label: 'γP on the secondary effects of prestress', unit: '', precision: 2, group: 'uls', symbol: '\\gamma_P', clause: 'EN 1992-1-1 2.4.2.2(1)' }, 0.8, 1.2).default(1.0),
    gammaC: num({ label: 'γc (concrete)', unit: '', precision: 2, group: 'uls', symbol: '\\gamma_c', clause: 'EN 1992-1-1 Table 2.1N' }, 1, 2).default(1.5),
    gammaS: num({ label: 'γs (steel)', unit: '', precision: 2, group: 'uls', symbol: '\\gamma_s', clause: 'EN 1992-1-1 Table 2.1N' }, 1, 1.5).default(1.15),
    alphaCC: num({ label: 'αcc (long-term effects on fcd)', unit: '', precision: 2, group: 'uls', symbol: '\\alpha_{cc}', clause: 'EN 1992-1-1 3.1.6(1)' }, 0.8, 1).default(1.0),
    branch: z.enum(['inclined', 'horizontal']).default('inclined')
      .meta({ label: 'Design stress–strain curve of the steel', unit: '', precision: 0, group: 'uls', clause: 'EN 1992-1-1 3.2.7(2), 3.3.6(7)', help: 'inclined top branch with a strain limit, or horizontal top branch' }),
    epsUdTendon: num({ label: 'εud of the strand', unit: '%', precision: 1, group: 'uls', symbol: '\\varepsilon_{ud}', clause: 'EN 1992-1-1 3.3.6(7)', help: '2 % where the supplier gives no value' }, 0.005, 0.05).default(0.02),
    deltaSigmaUnbonded: num({ label: 'Stress increase of unbonded tendons at ULS', unit: 'MPa', precision: 0, group: 'uls', symbol: '\\Delta\\sigma_{p,ULS}', clause: 'EN 1992-1-1 5.10.8(2)' }, 0, 500).default(100),
    fyk: num({ label: 'fyk of the reinforcement', unit: 'MPa', precision: 0, group: 'uls', symbol: 'f_{yk}', clause: 'EN 1992-1-1 3.2.2' }, 400, 600).default(500),
    barsBottom: bars('bottom'),
    barsTop: bars('top'),
  }).prefault({}),
  shear: z.object({
    fywk: num({ label: 'fywk of the links', unit: 'MPa', precision: 0, group: 'uls', symbol: 'f_{ywk}', clause: 'EN 1992-1-1 3.2.2' }, 400, 600).default(500),
    cotThetaMax: num({ label: 'Largest cot θ of the struts', unit: '', precision: 2, group: 'uls', symbol: '\\cot\\theta', clause: 'EN 1992-1-1 6.2.3(2)' }, 1, 2.5).default(2.5),
    ductMaterial: z.enum(['metal', 'plastic']).default('metal')
      .meta({ label: 'Duct material (grouted)', unit: '', precision: 0, group: 'uls', clause: 'EN 1992-1-1 6.2.3(6)' }),
    k1: num({ label: 'k1 on σcp (shear)', unit: '', precision: 2, group: 'uls', symbol: 'k_1', clause: 'EN 1992-1-1 6.2.2(1)' }, 0, 0.5).default(0.15),
  }).prefault({}),
  punching: z.object({
    column: z.enum(['none', 'interior', 'edge', 'corner']).default('none')
      .meta({ label: 'Punching check at a column head', unit: '', precision: 0, group: 'uls', clause: 'EN 1992-1-1 6.4', help: 'slab strips over columns; none skips the check' }),
    support: z.number().int('Support: a whole number').min(1, 'Supports are numbered from 1').max(11, 'At most 11 supports').default(2)
      .meta({ label: 'Support number of the column', unit: '', precision: 0, group: 'uls' }),
    c1: num({ label: 'Column size along the strip', unit: 'mm', precision: 0, group: 'uls', symbol: 'c_1' }, 100, 3000).default(400),
    c2: num({ label: 'Column size across the strip', unit: 'mm', precision: 0, group: 'uls', symbol: 'c_2' }, 100, 3000).default(400),
    panelWidth: num({ label: 'Panel width carried by the column line', unit: 'm', precision: 2, group: 'uls', symbol: 'l_2' }, 1000, 40000).default(8000),
    k1: num({ label: 'k1 on σcp (punching)', unit: '', precision: 2, group: 'uls', symbol: 'k_1', clause: 'EN 1992-1-1 6.4.4(1)' }, 0, 0.5).default(0.1),
    vRdMaxFactor: num({ label: 'vRd,max / (ν fcd)', unit: '', precision: 2, group: 'uls', clause: 'EN 1992-1-1 6.4.5(3), A1:2014' }, 0.3, 0.6).default(0.4),
  }).prefault({}),
  deflection: z.object({
    ratioTotal: num({ label: 'Span / deflection limit, total', unit: '', precision: 0, group: 'sls', clause: 'EN 1992-1-1 7.4.1(4)' }, 100, 1000).default(250),
    ratioAfter: num({ label: 'Span / deflection limit, after construction', unit: '', precision: 0, group: 'sls', clause: 'EN 1992-1-1 7.4.1(5)' }, 100, 2000).default(500),
    limit: num({ label: 'Engineer\'s limit on the long-term deflection', unit: 'mm', precision: 0, group: 'sls', help: 'leave out for none' }, 1, 500).optional(),
    beta: num({ label: 'β for the cracked share', unit: '', precision: 2, group: 'sls', symbol: '\\beta', clause: 'EN 1992-1-1 eq. (7.19)' }, 0.5, 1).default(0.5),
    phi: num({ label: 'Creep coefficient (override)', unit: '', precision: 2, group: 'sls', symbol: '\\varphi', clause: 'EN 1992-1-1 Annex B', help: 'leave out to use Annex B' }, 0, 6).optional(),
  }).prefault({}),
  cracking: z.object({
    duration: z.enum(['long', 'short']).default('long')
      .meta({ label: 'Duration of the load for kt', unit: '', precision: 0, group: 'sls', clause: 'EN 1992-1-1 7.3.4(2)' }),
    wmax: num({ label: 'Crack width limit (override)', unit: 'mm', precision: 2, group: 'sls', symbol: 'w_{max}', clause: 'EN 1992-1-1 Table 7.1N', help: 'leave out for Table 7.1N' }, 0.05, 0.5).optional(),
  }).prefault({}),
  site: z.object({
    spacing: num({ label: 'Station spacing of the height schedule', unit: 'mm', precision: 0, group: 'site', help: 'commonly 500 or 1000 mm' }, 100, 5000).default(1000),
    roundTo: num({ label: 'Chair heights rounded to', unit: 'mm', precision: 0, group: 'site', help: '5 mm is common practice; 0 leaves them unrounded' }, 0, 25).default(5),
    tendons: z.number().int('Tendons on the schedule: a whole number').min(1, 'At least one tendon').max(200, 'At most 200 tendons').optional()
      .meta({ label: 'Tendons on the stressing schedule', unit: '', precision: 0, group: 'site', help: 'beams default to the tendon count, slab strips to one typical tendon' }),
    alternateEnds: z.enum(['no', 'yes']).default('no')
      .meta({ label: 'Alternate the stressing end tendon by tendon', unit: '', precision: 0, group: 'site', help: 'for tendons stressed from one end' }),
    tolerance: num({ label: 'Acceptance band on measured extensions', unit: '%', precision: 0, group: 'site', help: '±7 % is common practice' }, 0, 0.5).default(0.07),
    jackLength: num({ label: 'Strand length inside the jack', unit: 'mm', precision: 0, group: 'site', help: 'its extension is added to the calculated value at each stressed end' }, 0, 2000).default(0),
    measured: z.array(num({ label: 'Measured extension', unit: 'mm', precision: 0, group: 'site' }, 0, 5000)).optional()
      .meta({ label: 'Measured extensions (total, tendon by tendon; 0 = not yet measured)', unit: 'mm', precision: 0, group: 'site' }),
  }).prefault({}),
}

export type Part2Input = { [K in keyof typeof part2InputShape]: z.output<(typeof part2InputShape)[K]> }
