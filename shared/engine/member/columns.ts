/**
 * Columns at the supports and the frame action they bring (EN 1992-1-1 5.3; flat slabs analysed as
 * equivalent frames, Annex I): each column restrains the member's rotation by 4EI/H (far end
 * fixed) or 3EI/H (far end pinned) on its gross section (Annex I.1.2(1)); the columns below and
 * above add up to one rotational spring at the support, used in every load case and in the
 * prestress analysis, so the secondary moments include their restraint. A slab strip 1 m wide
 * takes the springs per metre of the slab width each column line carries. The moments the member
 * passes into the columns are shared between those below and above in proportion to stiffness.
 */
import { columnStiffness } from '../analysis/continuous-beam'
import type { MemberInput } from '../input/schema'
import type { MemberSection } from './section'

export interface ColumnJoint {
  /** index of the support from 0, and its number on the sheet from 1 */
  support: number
  number: number
  /** stiffness of the columns below and above, N·mm/rad, in the width designed */
  kBelow: number
  kAbove: number
}

export interface MemberColumns {
  /** rotational spring at each support, N·mm/rad in the width designed (0 = none) */
  springs: number[]
  joints: ColumnJoint[]
  /** the columns' Ecm and second moment of area (gross, c2·c1³/12) */
  Ecm: number
  I: number
}

/** The springs the columns give each support, or none. */
export function memberColumns(input: MemberInput, section: MemberSection): MemberColumns | null {
  const c = input.columns
  if (c.where === 'none') return null
  const n = input.geometry.spans.length
  const Ecm = section.at28.Ecm // the member's concrete (EN 1992-1-1 Table 3.1)
  const I = (c.c2 * c.c1 ** 3) / 12 // gross section, bending in the member's plane (Annex I.1.2(1))
  const share = section.isSlab ? 1000 / c.panelWidth : 1 // a slab strip per metre of the column line's width
  const k = (height: number, farEnd: 'fixed' | 'pinned'): number => (height > 0 ? share * columnStiffness({ E: Ecm, I, height, farEnd }) : 0)
  const kBelow = k(c.heightBelow, c.farEndBelow)
  const kAbove = k(c.heightAbove, c.farEndAbove)
  const joints: ColumnJoint[] = []
  const springs = Array.from({ length: n + 1 }, (_, j) => {
    const free = input.geometry.supports?.[j] === 'free' // the tip of a cantilever has no column
    const has = !free && (c.where === 'all' || (j > 0 && j < n))
    if (!has) return 0
    joints.push({ support: j, number: j + 1, kBelow, kAbove })
    return kBelow + kAbove
  })
  return { springs, joints, Ecm, I }
}

