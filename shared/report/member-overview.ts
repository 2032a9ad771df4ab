/**
 * The front page of a pt-member report: the member in one line, then the governing quantities a
 * reader looks for first — prestress per metre (slab strip) or per beam, strands and their spacing,
 * average precompression, the share of the load balanced, the largest long-term deflection.
 */
import type { Design } from '../engine/member/design'
import { formatQuantity } from '../utils/units'
import type { ModelOverview, OverviewRow } from './model'

const KIND_WORDS: Record<string, string> = {
  'slab-strip': 'Solid slab strip',
  'tee-beam': 'T band beam',
  'ell-beam': 'L band beam',
  'rectangle': 'Rectangular beam',
  'flanged': 'Flanged beam',
}

const metres = (mm: number) => formatQuantity(mm, 'm', 2).replace(/\u202fm$/, '')

function memberLine(d: Design): string {
  const { section, geometry, materials, tendon } = d.input
  const spans = geometry.spans
  const shape = section.kind === 'slab-strip'
    ? `${formatQuantity(section.h, 'mm', 0)} deep`
    : `${formatQuantity(section.bw ?? section.b ?? 0, 'mm', 0)} × ${formatQuantity(section.h, 'mm', 0)}${section.hf ? ` with a ${formatQuantity(section.hf, 'mm', 0)} slab` : ''}`
  return `${KIND_WORDS[section.kind] ?? section.kind}, ${shape}, ${spans.length} span${spans.length === 1 ? '' : 's'} `
    + `${spans.map(metres).join(' / ')} m, ${materials.concreteClass}, ${tendon.strand} mm strand, ${tendon.bond}`
}

export function memberOverview(d: Design): ModelOverview {
  const slab = d.input.section.kind === 'slab-strip'
  const per = slab ? 'per metre width' : 'per beam'
  const rows: OverviewRow[] = []
  rows.push({ label: `Prestress to balance the chosen load, ${per}`, value: formatQuantity(d.balancing.governing, 'kN', 0), key: 'balancing.governing' })
  rows.push({
    label: `Mean force at transfer / in service, ${per}`,
    value: `${formatQuantity(d.force.meanTransfer, 'kN', 0)} / ${formatQuantity(d.force.meanService, 'kN', 0)}`,
    key: 'force.meanService',
  })
  const t = d.input.tendon
  rows.push({
    label: 'Strands and spacing',
    value: slab
      ? `${formatQuantity(d.jacking.strands, '', 1)} strands per metre: tendons of ${t.strandsPerTendon} × ${t.strand} mm at ${formatQuantity(t.spacing, 'mm', 0)}`
      : `${t.count} tendon${t.count === 1 ? '' : 's'} of ${t.strandsPerTendon} × ${t.strand} mm (${formatQuantity(d.jacking.strands, '', 0)} strands)`,
    key: 'balancing.strandsProvided',
  })
  rows.push({
    label: 'Average precompression P/A at transfer / in service',
    value: `${formatQuantity(d.precompression.transfer, 'MPa', 2)} / ${formatQuantity(d.precompression.service, 'MPa', 2)} (limits ${formatQuantity(d.precompression.min, 'MPa', 2)} to ${formatQuantity(d.precompression.max, 'MPa', 2)})`,
    key: 'precompression.service',
  })
  const balanced = d.balancing.balancedProvided
  if (balanced.length > 0 && d.loads.selfWeight > 0) {
    const least = balanced.reduce((a, b) => Math.min(a, b))
    const at = balanced.indexOf(least)
    rows.push({
      label: 'Load balanced by the tendons, least span',
      value: `${formatQuantity(least, 'kN/m', 2)} in span ${at + 1} = ${formatQuantity(least / d.loads.selfWeight, '%', 0)} of self-weight`,
      key: `balancing.balancedProvided.${at}`,
    })
  }
  const spans = d.deflection.spans
  if (spans.length > 0) {
    // one sign as in the deflection section: downward positive, an upward long-term deflection
    // (camber) negative and held to its own limit, span / ratioCamber (common practice)
    const worst = spans.reduce((a, s) => (s.utilisation > a.utilisation ? s : a))
    const { value } = worst.longTerm
    const camber = value < 0
    const size = Math.abs(value)
    rows.push({
      label: 'Largest long-term deflection',
      value: `${formatQuantity(value, 'mm', 1)} ${camber ? 'upward (camber)' : 'downward'} in span ${worst.span + 1} = L/${size > 0 ? Math.round(worst.L / size) : '∞'} (limit ${formatQuantity(camber ? worst.limitCamber : worst.limitTotal, 'mm', 1)})`,
      key: `deflection.spans.${worst.span}.longTerm.value`,
    })
  }
  return { member: memberLine(d), rows }
}
