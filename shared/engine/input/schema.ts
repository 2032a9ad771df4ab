/**
 * The input of a member design: one zod 4 schema, from which the editor's form is generated and
 * against which designMember validates; parseMemberInput turns its first issue into an
 * EngineInputError naming the field. Every number is in engine units (mm, N, MPa, N/mm, days;
 * fractions for percentages); `.meta()` gives the label, the display unit the engineer types in,
 * the decimals shown and the input group. National-annex values carry the recommended EN values as
 * defaults, each overridable. Optional groups can be added to `memberInputShape` as new keys with
 * `.default({})` or `.optional()`, and the refinements below stay as they are.
 */
import { z } from 'zod'
import { EngineInputError } from '../contract'
import type { DisplayUnit } from '../../utils/units'
import { CONCRETE_CLASSES } from '../materials/concrete'
import type { ConcreteClass } from '../materials/concrete'
import { EXPOSURE_CLASSES } from '../checks/stresses'
import { jointIssues } from '../prestress/segments'

export const INPUT_GROUPS = ['geometry', 'section', 'materials', 'loads', 'tendon', 'profile', 'losses', 'limits', 'annex', 'uls', 'sls', 'fire', 'site'] as const
export type InputGroup = (typeof INPUT_GROUPS)[number]

export type FieldMeta = {
  label: string
  unit: DisplayUnit
  precision: number
  group: InputGroup
  symbol?: string
  help?: string
  clause?: string
}

const meta = (m: FieldMeta): FieldMeta => m

/** A fraction entered in percent. */
function fraction(m: Omit<FieldMeta, 'unit'>, min = 0, max = 1): z.ZodNumber {
  return z.number({ error: `${m.label}: enter a number` })
    .min(min, `${m.label} must be at least ${min * 100} %`)
    .max(max, `${m.label} must not exceed ${max * 100} %`)
    .meta(meta({ ...m, unit: '%' }))
}

/** A plain factor (no unit). */
function factor(m: Omit<FieldMeta, 'unit' | 'precision'> & { precision?: number }, min: number, max: number): z.ZodNumber {
  return z.number({ error: `${m.label}: enter a number` })
    .min(min, `${m.label} must be at least ${min}`)
    .max(max, `${m.label} must not exceed ${max}`)
    .meta(meta({ precision: 2, ...m, unit: '' }))
}

function length(m: Omit<FieldMeta, 'unit'> & { unit?: DisplayUnit }, min: number, max: number): z.ZodNumber {
  const unit = m.unit ?? 'mm'
  const shown = (v: number): string => `${v / (unit === 'm' ? 1000 : 1)} ${unit}`
  return z.number({ error: `${m.label}: enter a number` })
    .min(min, min === 0 ? `${m.label} must not be negative` : `${m.label} must be at least ${shown(min)}`)
    .max(max, `${m.label} must not exceed ${shown(max)}`)
    .meta(meta({ ...m, unit }))
}

/** A number within [min, max], one message for both bounds where given. */
function bounded(m: FieldMeta, min: number, max: number, msg?: string): z.ZodNumber {
  return z.number({ error: `${m.label}: enter a number` })
    .min(min, msg ?? `${m.label} must be at least ${min}`)
    .max(max, msg ?? `${m.label} must not exceed ${max}`)
    .meta(m)
}

// the return type is left to inference so that the parsed input keeps its shape
function bars(where: 'bottom' | 'top') {
  const side = where === 'bottom' ? 'Bottom' : 'Top'
  return z.object({
    area: bounded({ label: `${side} bars, area in the width designed`, unit: 'mm²', precision: 0, group: 'uls', symbol: where === 'bottom' ? 'A_{s,bot}' : 'A_{s,top}', help: 'per metre for a slab strip; 0 for none' }, 0, 1e6, `${side} bar area must lie between 0 and 1 000 000 mm²`).default(0),
    diameter: bounded({ label: `${side} bar diameter`, unit: 'mm', precision: 0, group: 'uls', symbol: '\\phi' }, 6, 50, 'A bar diameter lies between 6 and 50 mm').default(12),
    cover: bounded({ label: `${side} cover to the bars`, unit: 'mm', precision: 0, group: 'uls', symbol: 'c', clause: 'EN 1992-1-1 4.4.1' }, 10, 150, 'The cover must lie between 10 and 150 mm').default(30),
  }).prefault({})
}

const CLASS_NAMES = Object.keys(CONCRETE_CLASSES) as [ConcreteClass, ...ConcreteClass[]]

const spanSchema = z.number({ error: 'Span length: enter a number' })
  .positive('Each span must be longer than zero')
  .min(1000, 'A span must be at least 1 m')
  .max(40000, 'A span must not exceed 40 m')
  .meta(meta({ label: 'Span length', unit: 'm', precision: 2, group: 'geometry', symbol: 'L' }))

/**
 * Loads beyond the uniform ones, each on one span, permanent or imposed with its own ψ factors
 * (EN 1990 Table A1.1): a point load on the member, a line load across it (a wall or façade, per
 * metre of the width it crosses, taken over the loaded width) and a uniform load over part of a span.
 */
function addedLoad<T extends z.ZodRawShape>(what: string, shape: T) {
  const m = (label: string, unit: DisplayUnit, precision: number, extra: Partial<FieldMeta> = {}): FieldMeta => ({ label, unit, precision, group: 'loads', ...extra })
  return z.object({
    span: z.number({ error: `${what}: enter the span number` }).int(`${what}: the span is a whole number`).min(1, `${what}: spans are numbered from 1`).max(1000, `${what}: at most span 1000`)
      .meta(m('Span (numbered from 1)', '', 0)),
    ...shape,
    type: z.enum(['permanent', 'imposed'], { error: `${what}: permanent or imposed` }).default('imposed')
      .meta(m('Action', '', 0, { help: 'permanent (a wall, a façade) or imposed (a plant load, a store)' })),
    psi0: z.number({ error: `${what}, ψ0: enter a number` }).min(0, `${what}: ψ0 must be at least 0`).max(1, `${what}: ψ0 must not exceed 1`).default(0.7)
      .meta(m('ψ0 (combination value)', '', 2, { symbol: '\\psi_0', clause: 'EN 1990 Table A1.1' })),
    psi1: z.number({ error: `${what}, ψ1: enter a number` }).min(0, `${what}: ψ1 must be at least 0`).max(1, `${what}: ψ1 must not exceed 1`).default(0.5)
      .meta(m('ψ1 (frequent value)', '', 2, { symbol: '\\psi_1', clause: 'EN 1990 Table A1.1' })),
    psi2: z.number({ error: `${what}, ψ2: enter a number` }).min(0, `${what}: ψ2 must be at least 0`).max(1, `${what}: ψ2 must not exceed 1`).default(0.3)
      .meta(m('ψ2 (quasi-permanent value)', '', 2, { symbol: '\\psi_2', clause: 'EN 1990 Table A1.1' })),
  })
}

const position = (what: string, label: string) => z.number({ error: `${what}: enter the ${label.toLowerCase()}` }).min(0, `${what}: the ${label.toLowerCase()} must not be negative`).max(40000, `${what}: the ${label.toLowerCase()} must not exceed 40 m`)
  .meta(meta({ label, unit: 'm', precision: 2, group: 'loads' }))

const pointLoadSchema = addedLoad('Point load', {
  at: position('Point load', 'Distance from the left support of the span'),
  P: z.number({ error: 'Point load: enter the load' }).min(-1e7, 'Point load: at most 10 000 kN').max(1e7, 'Point load: at most 10 000 kN')
    .meta(meta({ label: 'Load (downward +)', unit: 'kN', precision: 1, group: 'loads', symbol: 'F', help: 'on the member; for a slab strip, the share of one metre of strip width' })),
})
const lineLoadSchema = addedLoad('Line load', {
  at: position('Line load', 'Distance from the left support of the span'),
  w: z.number({ error: 'Line load: enter the load' }).min(-1000, 'Line load: at most 1000 kN/m').max(1000, 'Line load: at most 1000 kN/m')
    .meta(meta({ label: 'Load per metre of the line (downward +)', unit: 'kN/m', precision: 2, group: 'loads', symbol: 'w_l', help: 'a wall or façade across the member, taken over the width loaded' })),
})
const partialLoadSchema = addedLoad('Partial load', {
  from: position('Partial load', 'Start, from the left support of the span'),
  length: z.number({ error: 'Partial load: enter the length' }).positive('Partial load: the length must be more than zero').max(40000, 'Partial load: the length must not exceed 40 m')
    .meta(meta({ label: 'Length loaded', unit: 'm', precision: 2, group: 'loads' })),
  q: z.number({ error: 'Partial load: enter the load' }).min(-0.05, 'Partial load: at most 50 kN/m²').max(0.05, 'Partial load: at most 50 kN/m²')
    .meta(meta({ label: 'Load per unit area (downward +)', unit: 'kN/m²', precision: 2, group: 'loads', symbol: 'q_p', help: 'over the length given, on the width loaded' })),
})

/**
 * A drop panel or a thickened band over a support: the section deepened below its soffit over a
 * length each side of the support (m), across a width of the section (a slab strip: per metre).
 */
const dropSchema = z.object({
  support: z.number({ error: 'Drop: enter the support number' }).int('Drop: the support is a whole number').min(1, 'Drop: supports are numbered from 1').max(1001, 'Drop: at most support 1001')
    .meta(meta({ label: 'Support (numbered from 1)', unit: '', precision: 0, group: 'section' })),
  left: z.number({ error: 'Drop: enter the length to the left of the support' }).min(0, 'Drop: the length to the left must not be negative').max(20000, 'Drop: the length to the left must not exceed 20 m').default(0)
    .meta(meta({ label: 'Length to the left of the support', unit: 'm', precision: 2, group: 'section', help: 'from the support\'s centre line; 0 at the first support' })),
  right: z.number({ error: 'Drop: enter the length to the right of the support' }).min(0, 'Drop: the length to the right must not be negative').max(20000, 'Drop: the length to the right must not exceed 20 m').default(1200)
    .meta(meta({ label: 'Length to the right of the support', unit: 'm', precision: 2, group: 'section', help: 'from the support\'s centre line; 0 at the last support' })),
  depth: z.number({ error: 'Drop: enter the depth below the soffit' }).min(25, 'Drop: the depth below the soffit must be at least 25 mm').max(2000, 'Drop: the depth below the soffit must not exceed 2000 mm').default(150)
    .meta(meta({ label: 'Depth below the soffit', unit: 'mm', precision: 0, group: 'section', symbol: 'h_d' })),
  width: z.number({ error: 'Drop: enter the width' }).min(100, 'Drop: the width must be at least 100 mm').max(20000, 'Drop: the width must not exceed 20 m').optional()
    .meta(meta({ label: 'Width of the thickening', unit: 'mm', precision: 0, group: 'section', symbol: 'b_d', help: 'a slab strip: the drop\'s width per metre of strip (its width over the column line\'s width × 1000); left out: the whole width (a beam: its web)' })),
})

/**
 * A joint of a tendon built in segments, over an interior support: a construction joint with an
 * intermediate anchorage (stressing pocket) or a coupler; the segment stressed at the joint is the
 * one cast first at a coupler (the coupled one is stressed from its other end).
 */
const jointSchema = z.object({
  support: z.number({ error: 'Joint: enter the support number' }).int('Joint: the support number is a whole number').min(1, 'Joint: supports are numbered from 1 at the left end').max(1001, 'Joint: at most support 1001')
    .meta(meta({ label: 'Over support (numbered from 1)', unit: '', precision: 0, group: 'tendon', help: 'an interior support; the segments either side are stressed apart' })),
  kind: z.enum(['intermediate-anchorage', 'coupler'], { error: 'Joint: an intermediate anchorage or a coupler' }).default('intermediate-anchorage')
    .meta(meta({ label: 'Joint', unit: '', precision: 0, group: 'tendon', help: 'intermediate anchorage: each segment anchored at the joint (stressing pocket or construction joint); coupler: the next segment coupled to the anchorage of the one before' })),
  stressed: z.enum(['left', 'right', 'both', 'neither'], { error: 'Joint: the left, the right, both or neither segment' }).default('left')
    .meta(meta({ label: 'Segment stressed at the joint', unit: '', precision: 0, group: 'tendon', help: 'left: the segment on the left has its live anchorage here, the one on the right is anchored dead and stressed from its other end; at a coupler, the segment cast first' })),
})

const eccSchema = z.number({ error: 'Eccentricity: enter a number' })
  .min(-2000, 'The eccentricity must lie within the section').max(2000, 'The eccentricity must lie within the section')
  .meta(meta({ label: 'Eccentricity (below centroid +)', unit: 'mm', precision: 1, group: 'profile', symbol: 'e' }))

export const memberInputShape = {
  geometry: z.object({
    spans: z.array(spanSchema).min(1, 'Give at least one span').max(1000, 'At most 1000 spans')
      .meta(meta({ label: 'Spans', unit: 'm', precision: 2, group: 'geometry', symbol: 'L' })),
    supports: z.array(z.enum(['pinned', 'fixed', 'free'], { error: 'A support is pinned, fixed or free' }).meta(meta({ label: 'Support', unit: '', precision: 0, group: 'geometry', help: 'pinned: free to rotate; fixed: rotation restrained; free: no support, the end span is a cantilever (first or last support only)' })))
      .optional()
      .meta(meta({ label: 'Supports (left to right)', unit: '', precision: 0, group: 'geometry', help: 'one more than the spans; all pinned when left out' })),
  }),
  columns: z.object({
    where: z.enum(['none', 'interior', 'all']).default('none')
      .meta(meta({ label: 'Columns at the supports', unit: '', precision: 0, group: 'geometry', clause: 'EN 1992-1-1 5.3, Annex I', help: 'none: knife-edge supports; interior: at the interior supports; all: at every support (frame action)' })),
    c1: length({ label: 'Column size along the member', precision: 0, group: 'geometry', symbol: 'c_1' }, 150, 3000).default(400),
    c2: length({ label: 'Column size across the member', precision: 0, group: 'geometry', symbol: 'c_2' }, 150, 3000).default(400),
    heightBelow: length({ label: 'Height of the columns below (0 = none)', unit: 'm', precision: 2, group: 'geometry', symbol: 'H_b' }, 0, 30000).default(3500),
    farEndBelow: z.enum(['fixed', 'pinned']).default('fixed')
      .meta(meta({ label: 'Far end of the columns below', unit: '', precision: 0, group: 'geometry', help: 'fixed: 4EI/H; pinned: 3EI/H' })),
    heightAbove: length({ label: 'Height of the columns above (0 = none)', unit: 'm', precision: 2, group: 'geometry', symbol: 'H_a' }, 0, 30000).default(0),
    farEndAbove: z.enum(['fixed', 'pinned']).default('fixed')
      .meta(meta({ label: 'Far end of the columns above', unit: '', precision: 0, group: 'geometry', help: 'fixed: 4EI/H; pinned: 3EI/H' })),
    panelWidth: length({ label: 'Slab width per column line (slab strips)', unit: 'm', precision: 2, group: 'geometry', symbol: 'l_2', clause: 'EN 1992-1-1 Annex I.1.2', help: 'the strip is 1 m wide: it takes the columns\' stiffness per metre of this width' }, 1000, 40000).default(8000),
  }).prefault({}),
  section: z.object({
    kind: z.enum(['slab-strip', 'tee-beam', 'ell-beam', 'rectangle', 'flanged'])
      .meta(meta({ label: 'Section', unit: '', precision: 0, group: 'section', help: 'slab strip per metre width; T or L band beam; general rectangle or flanged section' })),
    h: length({ label: 'Overall depth', precision: 0, group: 'section', symbol: 'h' }, 100, 3000),
    b: length({ label: 'Width (rectangle)', precision: 0, group: 'section', symbol: 'b' }, 100, 20000).optional(),
    bw: length({ label: 'Web or band width', precision: 0, group: 'section', symbol: 'b_w' }, 100, 20000).optional(),
    bf: length({ label: 'Effective flange width', precision: 0, group: 'section', symbol: 'b_{eff}', clause: 'EN 1992-1-1 5.3.2.1' }, 100, 20000).optional(),
    hf: length({ label: 'Flange (slab) thickness', precision: 0, group: 'section', symbol: 'h_f' }, 50, 1000).optional(),
    tributaryWidth: length({ label: 'Width loaded (tributary)', precision: 0, group: 'section', symbol: 'b_{trib}', help: 'width whose area loads the member; the slab strip is 1 m; a band beam defaults to its flange width' }, 100, 30000).optional(),
    drops: z.array(dropSchema).max(1001, 'At most one drop per support').default([])
      .meta(meta({ label: 'Drops and thickenings over supports', unit: '', precision: 0, group: 'section', help: 'a deeper section each side of a support: drop panel, thickened band' })),
  }),
  materials: z.object({
    concreteClass: z.enum(CLASS_NAMES, { error: 'Choose a concrete class of EN 1992-1-1 Table 3.1' })
      .meta(meta({ label: 'Concrete class', unit: '', precision: 0, group: 'materials', clause: 'EN 1992-1-1 Table 3.1' })),
    cement: z.enum(['R', 'N', 'S']).default('N')
      .meta(meta({ label: 'Cement class', unit: '', precision: 0, group: 'materials', clause: 'EN 1992-1-1 3.1.2(6)' })),
    density: z.number().min(15e-6, 'Density must be at least 15 kN/m³').max(30e-6, 'Density must not exceed 30 kN/m³').default(25e-6)
      .meta(meta({ label: 'Density of reinforced concrete', unit: 'kN/m³', precision: 1, group: 'materials', symbol: '\\gamma_c', clause: 'EN 1991-1-1 Table A.1' })),
    ageAtStressing: z.number().min(1, 'Stress the tendons at an age of at least 1 day').max(365, 'Age at stressing must not exceed 365 days').default(5)
      .meta(meta({ label: 'Age at stressing', unit: 'days', precision: 0, group: 'materials', symbol: 't_0' })),
    RH: fraction({ label: 'Relative humidity', precision: 0, group: 'materials', symbol: 'RH', clause: 'EN 1992-1-1 Annex B' }, 0.2, 1).default(0.5),
  }),
  tendon: z.object({
    strand: z.enum(['12.5', '12.9', '15.2', '15.7'], { error: 'Choose a strand of prEN 10138-3' }).default('12.9')
      .meta(meta({ label: 'Strand (nominal diameter, mm)', unit: '', precision: 0, group: 'tendon', clause: 'prEN 10138-3 Y1860S7' })),
    strandsPerTendon: z.number().int('Strands per tendon: a whole number').min(1, 'A tendon needs at least one strand').max(55, 'At most 55 strands per tendon').default(4)
      .meta(meta({ label: 'Strands per tendon', unit: '', precision: 0, group: 'tendon', symbol: 'n_s' })),
    count: z.number().int('Number of tendons: a whole number').min(1, 'At least one tendon').max(60, 'At most 60 tendons').default(1)
      .meta(meta({ label: 'Tendons in the member (beams)', unit: '', precision: 0, group: 'tendon', symbol: 'n_t', help: 'used for beams and rectangles; a slab strip uses the spacing' })),
    spacing: length({ label: 'Tendon spacing (slab strip)', precision: 0, group: 'tendon', symbol: 's', help: 'centres of tendons across the slab; the strip carries 1000/s tendons' }, 150, 3000).default(600),
    ductShape: z.enum(['flat', 'round']).default('flat')
      .meta(meta({ label: 'Duct', unit: '', precision: 0, group: 'tendon' })),
    ductHeight: length({ label: 'Duct height (smaller dimension)', precision: 0, group: 'tendon', symbol: 'h_d' }, 10, 200).default(20),
    ductWidth: length({ label: 'Duct width (larger dimension)', precision: 0, group: 'tendon', symbol: 'b_d' }, 10, 400).default(75),
    centroidOffset: length({ label: 'Tendon centroid from the duct centre, away from the face', precision: 1, group: 'tendon', symbol: '\\Delta_d', help: 'at high and low points the strands bear on the far side of the duct; left out: (duct height − strand diameter)/2' }, 0, 100).optional(),
    bond: z.enum(['bonded', 'unbonded']).default('bonded')
      .meta(meta({ label: 'Bond', unit: '', precision: 0, group: 'tendon' })),
    coverTop: length({ label: 'Cover to duct, top', precision: 0, group: 'tendon', symbol: 'c_{top}', clause: 'EN 1992-1-1 4.4.1' }, 10, 150),
    coverBottom: length({ label: 'Cover to duct, bottom', precision: 0, group: 'tendon', symbol: 'c_{bot}', clause: 'EN 1992-1-1 4.4.1' }, 10, 150),
    stressing: z.enum(['left', 'right', 'both']).default('both')
      .meta(meta({ label: 'Stressed from', unit: '', precision: 0, group: 'tendon' })),
    jackingFactor: fraction({ label: 'Jacking stress as a share of σp,max', precision: 0, group: 'tendon', clause: 'EN 1992-1-1 5.10.2.1' }, 0.5, 1).default(1),
    joints: z.array(jointSchema).max(100, 'At most 100 joints').default([])
      .meta(meta({ label: 'Joints in the tendon (segments built in turn)', unit: '', precision: 0, group: 'tendon', help: 'a long member cast bay by bay: each joint over an interior support, each segment with its own friction, draw-in and extension; none: one tendon end to end' })),
  }),
  profile: z.object({
    mode: z.enum(['deepest', 'custom']).default('deepest')
      .meta(meta({ label: 'Profile', unit: '', precision: 0, group: 'profile', help: 'deepest: as high over supports and as low in spans as cover allows; custom: the eccentricities below' })),
    anchorLeft: eccSchema.default(0),
    anchorRight: eccSchema.default(0),
    supportEcc: z.array(eccSchema).optional()
      .meta(meta({ label: 'Eccentricity at each support', unit: 'mm', precision: 1, group: 'profile', symbol: 'e_{sup}' })),
    spanEcc: z.array(eccSchema).optional()
      .meta(meta({ label: 'Eccentricity at each low point', unit: 'mm', precision: 1, group: 'profile', symbol: 'e_{span}' })),
    lowPointAt: z.array(z.number().min(0.1, 'The low point must lie between 0.1 L and 0.9 L').max(0.9, 'The low point must lie between 0.1 L and 0.9 L')
      .meta(meta({ label: 'Low point (share of the span)', unit: '%', precision: 0, group: 'profile' }))).optional()
      .meta(meta({ label: 'Low point in each span (share of the span)', unit: '%', precision: 0, group: 'profile' })),
    inflection: fraction({ label: 'Reverse curve each side of a support (share of the span)', precision: 0, group: 'profile', symbol: '\\lambda' }, 0, 0.3).default(0.1),
  }).prefault({}),
  loads: z.object({
    superimposed: z.number().min(0, 'The superimposed dead load must not be negative').max(0.05, 'The superimposed dead load must not exceed 50 kN/m²')
      .meta(meta({ label: 'Superimposed dead load', unit: 'kN/m²', precision: 2, group: 'loads', symbol: 'g_{sdl}' })),
    imposed: z.number().min(0, 'The imposed load must not be negative').max(0.05, 'The imposed load must not exceed 50 kN/m²')
      .meta(meta({ label: 'Imposed load', unit: 'kN/m²', precision: 2, group: 'loads', symbol: 'q_k' })),
    psi0: factor({ label: 'ψ0 (combination value)', group: 'loads', symbol: '\\psi_0', clause: 'EN 1990 Table A1.1' }, 0, 1).default(0.7),
    psi1: factor({ label: 'ψ1 (frequent value)', group: 'loads', symbol: '\\psi_1', clause: 'EN 1990 Table A1.1' }, 0, 1).default(0.5),
    psi2: factor({ label: 'ψ2 (quasi-permanent value)', group: 'loads', symbol: '\\psi_2', clause: 'EN 1990 Table A1.1' }, 0, 1).default(0.3),
    pattern: z.enum(['alternate-and-adjacent', 'all-spans']).default('alternate-and-adjacent')
      .meta(meta({ label: 'Imposed load arrangement', unit: '', precision: 0, group: 'loads', clause: 'EN 1992-1-1 5.1.3' })),
    balanceSelfWeight: fraction({ label: 'Self-weight balanced', precision: 0, group: 'loads', help: 'commonly 60–100 % in slabs' }, 0, 1.5).default(0.9),
    balanceSuperimposed: fraction({ label: 'Superimposed dead load balanced', precision: 0, group: 'loads' }, 0, 1).default(0),
    balanceImposed: fraction({ label: 'Imposed load balanced', precision: 0, group: 'loads' }, 0, 1).default(0),
    points: z.array(pointLoadSchema).max(100, 'At most 100 point loads').default([])
      .meta(meta({ label: 'Point loads', unit: '', precision: 0, group: 'loads', help: 'each on one span, at a distance from its left support' })),
    lines: z.array(lineLoadSchema).max(100, 'At most 100 line loads').default([])
      .meta(meta({ label: 'Line loads across the member', unit: '', precision: 0, group: 'loads', help: 'walls and façades crossing the member, per metre of their length' })),
    partials: z.array(partialLoadSchema).max(100, 'At most 100 partial loads').default([])
      .meta(meta({ label: 'Uniform loads over part of a span', unit: '', precision: 0, group: 'loads' })),
  }),
  losses: z.object({
    model: z.enum(['detailed', 'percentage']).default('detailed')
      .meta(meta({ label: 'Long-term losses', unit: '', precision: 0, group: 'losses', help: 'detailed: creep, shrinkage and relaxation by 5.10.6; percentage: an accepted share of the force at transfer' })),
    longTermShare: fraction({ label: 'Accepted long-term loss', precision: 1, group: 'losses' }, 0, 0.4).default(0.12),
    mu: factor({ label: 'Friction coefficient μ', group: 'losses', symbol: '\\mu', clause: 'EN 1992-1-1 Table 5.1' }, 0, 0.5).default(0.19),
    wobble: z.number().min(0, 'The unintentional angle must not be negative').max(5e-5, 'The unintentional angle must not exceed 0.05 rad/m').default(5e-6)
      .meta(meta({ label: 'Unintentional angular displacement k', unit: 'rad/m', precision: 4, group: 'losses', symbol: 'k', clause: 'EN 1992-1-1 5.10.5.2(3)' })),
    drawIn: length({ label: 'Anchorage draw-in', precision: 1, group: 'losses', symbol: '\\Delta_{set}', clause: 'EN 1992-1-1 5.10.5.3' }, 0, 20).default(6),
    relaxationClass: z.enum(['1', '2', '3']).default('2')
      .meta(meta({ label: 'Relaxation class', unit: '', precision: 0, group: 'losses', clause: 'EN 1992-1-1 3.3.2(4)' })),
    curingEnd: z.number().min(1, 'Drying starts at an age of at least 1 day').max(60, 'Drying must start by 60 days').default(3)
      .meta(meta({ label: 'Age at the end of curing', unit: 'days', precision: 0, group: 'losses', symbol: 't_s' })),
    serviceLife: z.number().min(365, 'The design working life must be at least one year').max(73000, 'At most 200 years').default(18250)
      .meta(meta({ label: 'Age for final losses (design working life)', unit: 'days', precision: 0, group: 'losses', symbol: 't_\\infty', clause: 'EN 1990 Table 2.1' })),
  }).prefault({}),
  limits: z.object({
    exposure: z.enum(EXPOSURE_CLASSES as [string, ...string[]], { error: 'Choose an exposure class of EN 1992-1-1 Table 4.1' }).default('XC1')
      .meta(meta({ label: 'Exposure class', unit: '', precision: 0, group: 'limits', clause: 'EN 1992-1-1 Table 4.1, Table 7.1N' })),
    transferTension: factor({ label: 'Tension at transfer, share of fctm(t)', group: 'limits', clause: 'EN 1992-1-1 7.1(2)' }, 0, 1.5).default(1),
    serviceTension: factor({ label: 'Tension in service, share of fctm', group: 'limits', clause: 'EN 1992-1-1 7.1(2)' }, 0, 1.5).default(1),
    precompressionMin: z.number().min(0, 'must not be negative').max(10, 'at most 10 MPa').default(0.7)
      .meta(meta({ label: 'Least average precompression (practice)', unit: 'MPa', precision: 2, group: 'limits', help: 'common practice for slabs about 0.7–1.0 MPa' })),
    precompressionMax: z.number().min(0.5, 'at least 0.5 MPa').max(20, 'at most 20 MPa').default(3.5)
      .meta(meta({ label: 'Largest average precompression (practice)', unit: 'MPa', precision: 2, group: 'limits', help: 'common practice for slabs about 2.5–3.5 MPa' })),
  }).prefault({}),
  annex: z.object({
    k1: factor({ label: 'k1 (σp,max / fpk)', group: 'annex', symbol: 'k_1', clause: 'EN 1992-1-1 5.10.2.1(1)' }, 0.5, 1).default(0.8),
    k2: factor({ label: 'k2 (σp,max / fp0.1k)', group: 'annex', symbol: 'k_2', clause: 'EN 1992-1-1 5.10.2.1(1)' }, 0.5, 1).default(0.9),
    k7: factor({ label: 'k7 (σpm0 / fpk)', group: 'annex', symbol: 'k_7', clause: 'EN 1992-1-1 5.10.3(2)' }, 0.5, 1).default(0.75),
    k8: factor({ label: 'k8 (σpm0 / fp0.1k)', group: 'annex', symbol: 'k_8', clause: 'EN 1992-1-1 5.10.3(2)' }, 0.5, 1).default(0.85),
    transferCompression: factor({ label: 'Compression at transfer, share of fck(t)', group: 'annex', clause: 'EN 1992-1-1 5.10.2.2(5)' }, 0.3, 0.8).default(0.6),
    k1Service: factor({ label: 'k1 (characteristic compression / fck)', group: 'annex', symbol: 'k_1', clause: 'EN 1992-1-1 7.2(2)' }, 0.3, 0.8).default(0.6),
    k2Service: factor({ label: 'k2 (quasi-permanent compression / fck)', group: 'annex', symbol: 'k_2', clause: 'EN 1992-1-1 7.2(3)' }, 0.3, 0.8).default(0.45),
    k5: factor({ label: 'k5 (tendon stress in service / fpk)', group: 'annex', symbol: 'k_5', clause: 'EN 1992-1-1 7.2(5)' }, 0.5, 1).default(0.75),
    rsupBonded: factor({ label: 'rsup, bonded post-tensioning', group: 'annex', symbol: 'r_{sup}', clause: 'EN 1992-1-1 5.10.9(1)' }, 1, 1.3).default(1.1),
    rinfBonded: factor({ label: 'rinf, bonded post-tensioning', group: 'annex', symbol: 'r_{inf}', clause: 'EN 1992-1-1 5.10.9(1)' }, 0.7, 1).default(0.9),
    rsupUnbonded: factor({ label: 'rsup, unbonded tendons', group: 'annex', symbol: 'r_{sup}', clause: 'EN 1992-1-1 5.10.9(1)' }, 1, 1.3).default(1.05),
    rinfUnbonded: factor({ label: 'rinf, unbonded tendons', group: 'annex', symbol: 'r_{inf}', clause: 'EN 1992-1-1 5.10.9(1)' }, 0.7, 1).default(0.95),
  }).prefault({}),
  // ultimate limit state, shear, punching, deflection, cracking and the site schedules: optional groups with defaults
  uls: z.object({
    combination: z.enum(['6.10', '6.10a/b']).default('6.10')
      .meta({ label: 'Fundamental combination', unit: '', precision: 0, group: 'uls', clause: 'EN 1990 6.4.3.2', help: 'eq. (6.10), or the less favourable of eqs. (6.10a) and (6.10b)' }),
    gammaG: bounded({ label: 'γG,sup (permanent, unfavourable)', unit: '', precision: 2, group: 'uls', symbol: '\\gamma_G', clause: 'EN 1990 Table A1.2(B)' }, 1, 2).default(1.35),
    gammaQ: bounded({ label: 'γQ (imposed)', unit: '', precision: 2, group: 'uls', symbol: '\\gamma_Q', clause: 'EN 1990 Table A1.2(B)' }, 1, 2).default(1.5),
    xi: bounded({ label: 'ξ of eq. (6.10b)', unit: '', precision: 2, group: 'uls', symbol: '\\xi', clause: 'EN 1990 Table A1.2(B)' }, 0.5, 1).default(0.85),
    gammaP: bounded({ label: 'γP on the secondary effects of prestress', unit: '', precision: 2, group: 'uls', symbol: '\\gamma_P', clause: 'EN 1992-1-1 2.4.2.2(1)' }, 0.8, 1.2).default(1.0),
    gammaC: bounded({ label: 'γc (concrete)', unit: '', precision: 2, group: 'uls', symbol: '\\gamma_c', clause: 'EN 1992-1-1 Table 2.1N' }, 1, 2).default(1.5),
    gammaS: bounded({ label: 'γs (steel)', unit: '', precision: 2, group: 'uls', symbol: '\\gamma_s', clause: 'EN 1992-1-1 Table 2.1N' }, 1, 1.5).default(1.15),
    alphaCC: bounded({ label: 'αcc (long-term effects on fcd)', unit: '', precision: 2, group: 'uls', symbol: '\\alpha_{cc}', clause: 'EN 1992-1-1 3.1.6(1)' }, 0.8, 1).default(1.0),
    branch: z.enum(['inclined', 'horizontal']).default('inclined')
      .meta({ label: 'Design stress–strain curve of the steel', unit: '', precision: 0, group: 'uls', clause: 'EN 1992-1-1 3.2.7(2), 3.3.6(7)', help: 'inclined top branch with a strain limit, or horizontal top branch' }),
    epsUdTendon: bounded({ label: 'εud of the strand', unit: '%', precision: 1, group: 'uls', symbol: '\\varepsilon_{ud}', clause: 'EN 1992-1-1 3.3.6(7)', help: '2 % where the supplier gives no value' }, 0.005, 0.05).default(0.02),
    deltaSigmaUnbonded: bounded({ label: 'Stress increase of unbonded tendons at ULS', unit: 'MPa', precision: 0, group: 'uls', symbol: '\\Delta\\sigma_{p,ULS}', clause: 'EN 1992-1-1 5.10.8(2)' }, 0, 500).default(100),
    fyk: bounded({ label: 'fyk of the reinforcement', unit: 'MPa', precision: 0, group: 'uls', symbol: 'f_{yk}', clause: 'EN 1992-1-1 3.2.2' }, 400, 600).default(500),
    barsBottom: bars('bottom'),
    barsTop: bars('top'),
  }).prefault({}),
  shear: z.object({
    fywk: bounded({ label: 'fywk of the links', unit: 'MPa', precision: 0, group: 'uls', symbol: 'f_{ywk}', clause: 'EN 1992-1-1 3.2.2' }, 400, 600).default(500),
    cotThetaMax: bounded({ label: 'Largest cot θ of the struts', unit: '', precision: 2, group: 'uls', symbol: '\\cot\\theta', clause: 'EN 1992-1-1 6.2.3(2)' }, 1, 2.5).default(2.5),
    ductMaterial: z.enum(['metal', 'plastic']).default('metal')
      .meta({ label: 'Duct material (grouted)', unit: '', precision: 0, group: 'uls', clause: 'EN 1992-1-1 6.2.3(6)' }),
    k1: bounded({ label: 'k1 on σcp (shear)', unit: '', precision: 2, group: 'uls', symbol: 'k_1', clause: 'EN 1992-1-1 6.2.2(1)' }, 0, 0.5).default(0.15),
  }).prefault({}),
  punching: z.object({
    column: z.enum(['none', 'interior', 'edge', 'corner']).default('none')
      .meta({ label: 'Punching check at a column head', unit: '', precision: 0, group: 'uls', clause: 'EN 1992-1-1 6.4', help: 'slab strips over columns; none skips the check' }),
    support: z.number().int('Support: a whole number').min(1, 'Supports are numbered from 1').max(1001, 'At most 1001 supports').default(2)
      .meta({ label: 'Support number of the column', unit: '', precision: 0, group: 'uls' }),
    c1: bounded({ label: 'Column size along the strip', unit: 'mm', precision: 0, group: 'uls', symbol: 'c_1' }, 100, 3000).default(400),
    c2: bounded({ label: 'Column size across the strip', unit: 'mm', precision: 0, group: 'uls', symbol: 'c_2' }, 100, 3000).default(400),
    panelWidth: bounded({ label: 'Panel width carried by the column line', unit: 'm', precision: 2, group: 'uls', symbol: 'l_2' }, 1000, 40000).default(8000),
    k1: bounded({ label: 'k1 on σcp (punching)', unit: '', precision: 2, group: 'uls', symbol: 'k_1', clause: 'EN 1992-1-1 6.4.4(1)' }, 0, 0.5).default(0.1),
    vRdMaxFactor: bounded({ label: 'vRd,max / (ν fcd)', unit: '', precision: 2, group: 'uls', clause: 'EN 1992-1-1 6.4.5(3), A1:2014' }, 0.3, 0.6).default(0.4),
  }).prefault({}),
  deflection: z.object({
    ratioTotal: bounded({ label: 'Span / deflection limit, total', unit: '', precision: 0, group: 'sls', clause: 'EN 1992-1-1 7.4.1(4)' }, 100, 1000).default(250),
    ratioAfter: bounded({ label: 'Span / deflection limit, after construction', unit: '', precision: 0, group: 'sls', clause: 'EN 1992-1-1 7.4.1(5)' }, 100, 2000).default(500),
    ratioCamber: bounded({ label: 'Span / upward deflection (camber) limit', unit: '', precision: 0, group: 'sls', help: 'common practice for appearance: span/250 upward, as for the sag of 7.4.1(4)' }, 100, 1000).default(250),
    limit: bounded({ label: 'Engineer\'s limit on the long-term deflection', unit: 'mm', precision: 0, group: 'sls', help: 'leave out for none' }, 1, 500).optional(),
    beta: bounded({ label: 'β for the cracked share', unit: '', precision: 2, group: 'sls', symbol: '\\beta', clause: 'EN 1992-1-1 eq. (7.19)' }, 0.5, 1).default(0.5),
    phi: bounded({ label: 'Creep coefficient (override)', unit: '', precision: 2, group: 'sls', symbol: '\\varphi', clause: 'EN 1992-1-1 Annex B', help: 'leave out to use Annex B' }, 0, 6).optional(),
  }).prefault({}),
  cracking: z.object({
    duration: z.enum(['long', 'short']).default('long')
      .meta({ label: 'Duration of the load for kt', unit: '', precision: 0, group: 'sls', clause: 'EN 1992-1-1 7.3.4(2)' }),
    wmax: bounded({ label: 'Crack width limit (override)', unit: 'mm', precision: 2, group: 'sls', symbol: 'w_{max}', clause: 'EN 1992-1-1 Table 7.1N', help: 'leave out for Table 7.1N' }, 0.05, 0.5).optional(),
  }).prefault({}),
  fire: z.object({
    rating: z.enum(['none', 'R60', 'R90', 'R120', 'R180', 'R240']).default('none')
      .meta({ label: 'Fire resistance required', unit: '', precision: 0, group: 'fire', clause: 'EN 1992-1-2 5', help: 'standard fire exposure from below; none skips the check' }),
    slab: z.enum(['flat-slab', 'one-way', 'two-way']).default('flat-slab')
      .meta({ label: 'Slab kind for the fire tables (slab strips)', unit: '', precision: 0, group: 'fire', clause: 'EN 1992-1-2 5.7', help: 'flat slab on columns, or a slab spanning one or two ways onto beams or walls' }),
    spanRatio: bounded({ label: 'Ratio of the spans ly/lx (two-way slabs)', unit: '', precision: 2, group: 'fire', symbol: 'l_y/l_x', clause: 'EN 1992-1-2 Table 5.8' }, 1, 10).default(1),
  }).prefault({}),
  anchorage: z.object({
    plateWidth: length({ label: 'Anchor plate width (across the member)', precision: 0, group: 'tendon', symbol: 'a_1', help: "the supplier's data govern; left out: 250 mm for a flat duct, 180 mm for a round one (common practice)" }, 50, 1000).optional(),
    plateHeight: length({ label: 'Anchor plate height', precision: 0, group: 'tendon', symbol: 'a_2', help: "left out: 90 mm for a flat duct, 180 mm for a round one (common practice)" }, 30, 1000).optional(),
  }).prefault({}),
  site: z.object({
    spacing: bounded({ label: 'Station spacing of the height schedule', unit: 'mm', precision: 0, group: 'site', help: 'commonly 500 or 1000 mm' }, 100, 5000).default(1000),
    roundTo: bounded({ label: 'Chair heights rounded to', unit: 'mm', precision: 0, group: 'site', help: '5 mm is common practice; 0 leaves them unrounded' }, 0, 25).default(5),
    tendons: z.number().int('Tendons on the schedule: a whole number').min(1, 'At least one tendon').max(200, 'At most 200 tendons').optional()
      .meta({ label: 'Tendons on the stressing schedule', unit: '', precision: 0, group: 'site', help: 'overrides the count: beams default to their tendons, slab strips to the width of strip below (one typical tendon where it is left out)' }),
    stripWidth: length({ label: 'Width of slab on the stressing schedule (slab strips)', unit: 'm', precision: 2, group: 'site', symbol: 'b_{sch}', help: 'the width of the floor whose tendons this schedule lists, e.g. the design strip between column lines: width / spacing tendons, rounded' }, 500, 100000).optional(),
    alternateEnds: z.enum(['no', 'yes']).default('no')
      .meta({ label: 'Alternate the stressing end tendon by tendon', unit: '', precision: 0, group: 'site', help: 'for tendons stressed from one end' }),
    tolerance: bounded({ label: 'Acceptance band on measured extensions', unit: '%', precision: 0, group: 'site', help: '±7 % is common practice' }, 0, 0.5).default(0.07),
    jackLength: bounded({ label: 'Strand length inside the jack', unit: 'mm', precision: 0, group: 'site', help: 'its extension is added to the calculated value at each stressed end' }, 0, 2000).default(0),
    measured: z.array(bounded({ label: 'Measured extension', unit: 'mm', precision: 0, group: 'site' }, 0, 5000)).optional()
      .meta({ label: 'Measured extensions (total, tendon by tendon; 0 = not yet measured)', unit: 'mm', precision: 0, group: 'site' }),
  }).prefault({}),
}

type Ctx = z.RefinementCtx

function refineMember(v: z.output<z.ZodObject<typeof memberInputShape>>, ctx: Ctx): void {
  const n = v.geometry.spans.length
  const issue = (path: Array<string | number>, message: string): void => ctx.addIssue({ code: 'custom', path, message })
  const sup = v.geometry.supports
  if (sup && sup.length !== n + 1) {
    issue(['geometry', 'supports'], `Give ${n + 1} supports for ${n} span${n === 1 ? '' : 's'}`)
  }
  sup?.forEach((k, j) => {
    if (k === 'free' && j > 0 && j < n) issue(['geometry', 'supports', j], `Support ${j + 1}: only the first or last support can be free (a cantilever); an interior support must be pinned or fixed`)
  })
  if (sup && sup.length === n + 1 && sup[0] === 'free' && sup[n] === 'free' && n <= 2) {
    issue(['geometry', 'supports', 0], n === 1 ? 'A single span free at both ends has no support' : 'Two cantilevers need a span between two supports: give at least three spans, or make one end pinned or fixed')
  }
  if (sup && sup.length === n + 1 && n === 1 && (sup[0] === 'free') !== (sup[1] === 'free')) {
    const root = sup[0] === 'free' ? 1 : 0
    if (sup[root] !== 'fixed' && v.columns.where !== 'all') issue(['geometry', 'supports', root], `Support ${root + 1}: a lone cantilever turns about a pinned root; make the root fixed or give it columns`)
  }
  if (v.columns.where !== 'none' && v.columns.heightBelow === 0 && v.columns.heightAbove === 0) {
    issue(['columns', 'heightBelow'], 'Give the height of the columns below or above the member')
  }
  if (v.columns.where !== 'none' && sup?.some((k, j) => k === 'fixed' && (v.columns.where === 'all' || (j > 0 && j < n)))) {
    issue(['columns', 'where'], 'A fixed support already stops rotation: give columns only at pinned supports')
  }
  const within = (kind: 'points' | 'lines' | 'partials', what: string): void => {
    v.loads[kind].forEach((l, k) => {
      const L = v.geometry.spans[l.span - 1]
      if (L === undefined) {
        issue(['loads', kind, k, 'span'], `${what} ${k + 1}: there is no span ${l.span}; the member has ${n} span${n === 1 ? '' : 's'}`)
        return
      }
      const start = 'at' in l ? l.at : l.from
      const end = 'length' in l ? l.from + l.length : start
      if (end > L + 1e-6) issue(['loads', kind, k, 'at' in l ? 'at' : 'length'], `${what} ${k + 1}: it lies beyond the end of span ${l.span} (${(L / 1000).toFixed(2)} m long)`)
    })
  }
  within('points', 'Point load')
  within('lines', 'Line load')
  within('partials', 'Partial load')
  for (const j of jointIssues(n, v.tendon.stressing, v.tendon.joints)) {
    issue(j.joint === null ? ['tendon', 'stressing'] : ['tendon', 'joints', j.joint, j.field], j.message)
  }
  const s = v.section
  refineDrops(v, issue)
  if (s.kind === 'rectangle' && s.b === undefined) issue(['section', 'b'], 'Give the width of the rectangle')
  if (s.kind === 'tee-beam' || s.kind === 'ell-beam' || s.kind === 'flanged') {
    if (s.bw === undefined) issue(['section', 'bw'], 'Give the web or band width')
    if (s.bf === undefined) issue(['section', 'bf'], 'Give the effective flange width')
    if (s.hf === undefined) issue(['section', 'hf'], 'Give the flange (slab) thickness')
    if (s.bw !== undefined && s.bf !== undefined && s.bf < s.bw) issue(['section', 'bf'], 'The flange width must not be less than the web width')
    if (s.hf !== undefined && s.hf >= s.h) issue(['section', 'hf'], 'The flange must be thinner than the overall depth')
  }
  if (v.tendon.coverTop + v.tendon.coverBottom + 2 * v.tendon.ductHeight >= s.h) {
    issue(['tendon', 'coverBottom'], 'Covers and ducts leave no room for a drape in this depth')
  }
  if (v.tendon.ductWidth < v.tendon.ductHeight) issue(['tendon', 'ductWidth'], 'The duct width must not be less than its height')
  if (v.tendon.centroidOffset !== undefined && v.tendon.centroidOffset > v.tendon.ductHeight / 2) issue(['tendon', 'centroidOffset'], 'The tendon centroid must lie within the duct')
  const p = v.profile
  if (p.mode === 'custom') {
    if (!p.supportEcc) issue(['profile', 'supportEcc'], 'Give the eccentricity at each support for a custom profile')
    if (!p.spanEcc) issue(['profile', 'spanEcc'], 'Give the eccentricity at each low point for a custom profile')
  }
  if (p.supportEcc && p.supportEcc.length !== n + 1) issue(['profile', 'supportEcc'], `Give ${n + 1} support eccentricities for ${n} spans`)
  if (p.spanEcc && p.spanEcc.length !== n) issue(['profile', 'spanEcc'], `Give ${n} low-point eccentricities`)
  if (p.lowPointAt && p.lowPointAt.length !== n) issue(['profile', 'lowPointAt'], `Give ${n} low-point positions`)
}

/** Drops sit over a support of the member, within the spans each side, apart from one another. */
function refineDrops(v: z.output<z.ZodObject<typeof memberInputShape>>, issue: (path: Array<string | number>, message: string) => void): void {
  const spans = v.geometry.spans
  const n = spans.length
  const m = (x: number): string => `${(x / 1000).toFixed(2)} m`
  const s = v.section
  const full = s.kind === 'slab-strip' ? 1000 : s.kind === 'rectangle' ? s.b : s.bw
  const taken = new Map<number, number>()
  v.section.drops.forEach((d, k) => {
    const what = `Drop ${k + 1}`
    const j = d.support - 1
    if (j > n) return issue(['section', 'drops', k, 'support'], `${what}: there is no support ${d.support}; the member has ${n + 1} supports`)
    if (v.geometry.supports?.[j] === 'free') return issue(['section', 'drops', k, 'support'], `${what}: support ${d.support} is the free tip of a cantilever; a drop sits over a support`)
    const before = taken.get(j)
    if (before !== undefined) return issue(['section', 'drops', k, 'support'], `${what}: support ${d.support} already has drop ${before + 1}`)
    taken.set(j, k)
    if (j === 0 && d.left > 0) issue(['section', 'drops', k, 'left'], `${what}: support 1 is the left end; the drop can only run to the right of it (give 0 m to the left)`)
    if (j === n && d.right > 0) issue(['section', 'drops', k, 'right'], `${what}: support ${n + 1} is the right end; the drop can only run to the left of it (give 0 m to the right)`)
    if (d.left + d.right <= 0) issue(['section', 'drops', k, j === 0 ? 'right' : 'left'], `${what}: give the length of the drop each side of the support`)
    const Lleft = spans[j - 1]
    const Lright = spans[j]
    if (Lleft !== undefined && d.left >= Lleft) issue(['section', 'drops', k, 'left'], `${what}: ${m(d.left)} to the left is not shorter than span ${j} (${m(Lleft)})`)
    if (Lright !== undefined && d.right >= Lright) issue(['section', 'drops', k, 'right'], `${what}: ${m(d.right)} to the right is not shorter than span ${j + 1} (${m(Lright)})`)
    const beam = s.kind !== 'slab-strip' && s.kind !== 'rectangle'
    if (beam && d.width !== undefined && d.width !== s.bw) issue(['section', 'drops', k, 'width'], `${what}: under a beam the drop deepens the web over its own width; leave the width out`)
    else if (d.width !== undefined && full !== undefined && d.width > full) issue(['section', 'drops', k, 'width'], `${what}: the width ${d.width.toFixed(0)} mm exceeds the ${s.kind === 'slab-strip' ? 'strip\'s 1000 mm' : `section's ${full.toFixed(0)} mm`}`)
  })
  // two drops in one span must not meet
  for (const [j, k] of taken) {
    const other = taken.get(j + 1)
    const L = spans[j]
    if (other === undefined || L === undefined) continue
    const a = v.section.drops[k]
    const b = v.section.drops[other]
    if (a && b && a.right + b.left >= L) issue(['section', 'drops', other, 'left'], `Drop ${other + 1}: it meets drop ${k + 1} in span ${j + 1} (${m(a.right)} + ${m(b.left)} of ${m(L)}); give one longer drop as a deeper section or shorten them`)
  }
}

export const memberInputSchema = z.object(memberInputShape).superRefine(refineMember)

export type MemberInput = z.output<typeof memberInputSchema>
/** What a caller may pass: defaults may be left out. */
export type MemberInputDraft = z.input<typeof memberInputSchema>

/** Validate raw input with the schema; the first issue becomes an EngineInputError naming its path. */
export function parseMemberInput(raw: unknown): MemberInput {
  const r = memberInputSchema.safeParse(raw)
  if (!r.success) {
    const issue = r.error.issues[0]
    const path = issue ? issue.path.map(String).join('.') : ''
    throw new EngineInputError(path || 'input', issue?.message ?? 'invalid input')
  }
  return r.data
}
