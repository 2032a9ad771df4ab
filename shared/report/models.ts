/**
 * The engine models templates can bind to, by the name in their front matter. 'pt-member' is the
 * post-tensioned continuous member of shared/engine (designMember), with its input schema, its
 * result catalogue and its figures drawn from Design.series.
 */
import { RESULT_SPECS, specFor } from '../engine/results/specs'
import { DEMO_BB1, DEMO_PS2 } from '../engine/input/demo'
import { designMember } from '../engine/member/design'
import type { Design } from '../engine/member/design'
import type { CriticalSection } from '../engine/member/stress-limits'
import { INPUT_GROUPS, memberInputSchema } from '../engine/input/schema'
import { inputFieldSpecs } from '../engine/input/field-specs'
import { getPath } from '../utils/paths'
import { isRelevant } from '../sheet/relevance'
import { memberOverview } from './member-overview'
import { magnelSvg } from './figures/magnel'
import { momentDiagramSvg } from './figures/moments'
import { deflectionSvg } from './figures/deflection'
import { forceAlongTendonSvg } from './figures/force'
import { stressEnvelopeSvg } from './figures/stresses'
import { PALETTE } from './figures/svg'
import type { PlotMark } from './figures/svg'
import { tendonProfileSvg } from './figures/tendon'
import { ulsMomentSvg, ulsShearSvg } from './figures/uls-envelopes'
import { shapeOf } from './model'
import type { FigureMark, ModelFigure, ReportModel, ShapeKind } from './model'

function supportsX(d: Design): number[] {
  const out = [0]
  for (const L of d.input.geometry.spans) out.push(out[out.length - 1]! + L)
  return out
}

/** Where the figures mark a support: every support but the free tip of a cantilever. */
function supportMarks(d: Design): number[] {
  return supportsX(d).filter((_, j) => d.input.geometry.supports?.[j] !== 'free')
}

/** The section a figure is about: the one `at` names, else the one nearest its limits. */
function sectionAt(d: Design, at: string | undefined): CriticalSection | undefined {
  const named = at === undefined ? undefined : (getPath(d, at) as CriticalSection | undefined)
  if (named) return named
  return d.sections.reduce<CriticalSection | undefined>((a, s) => (!a || s.utilisation > a.utilisation ? s : a), undefined)
}

/** The fibre-stress envelope of one stage (transfer or service) against its limits. */
function stressFigure(stage: 'Transfer' | 'Service', words: string): ModelFigure {
  return {
    label: `Fibre stresses ${words} against their limits`,
    render: (r) => {
      const s = (r as Design).series
      return stressEnvelopeSvg({
        title: `Fibre stresses ${words}`,
        X: s.X,
        topMin: s[`stress${stage}TopMin`],
        topMax: s[`stress${stage}TopMax`],
        bottomMin: s[`stress${stage}BottomMin`],
        bottomMax: s[`stress${stage}BottomMax`],
        compressionLimit: s[`limit${stage}Compression`],
        tensionLimit: s[`limit${stage}Tension`],
      })
    },
  }
}

/** The point, line and partial loads of a design, placed along the member for the figures. */
function addedLoadMarks(d: Design): Array<{ label: string; X: number; X2?: number }> {
  const spans = d.input.geometry.spans
  const start = (span: number): number => spans.slice(0, span - 1).reduce((a, b) => a + b, 0)
  const l = d.input.loads
  return [
    ...(l.points ?? []).map((p, k) => ({ label: `P${k + 1}`, X: start(p.span) + p.at })),
    ...(l.lines ?? []).map((p, k) => ({ label: `W${k + 1}`, X: start(p.span) + p.at })),
    ...(l.partials ?? []).map((p, k) => ({ label: `Q${k + 1}`, X: start(p.span) + p.from, X2: start(p.span) + p.from + p.length })),
  ]
}

/** The engineer's marks in a figure's plotted units: values in the engine's unit ÷ `per`, places from mm to m. */
function plotted(marks: readonly FigureMark[] | undefined, per: number): PlotMark[] {
  return (marks ?? []).map((m) => ({ label: m.label, axis: m.axis, value: m.axis === 'x' ? m.value / 1000 : m.value / per }))
}

/** Moments are N·mm along mm, shears and forces N, deflections mm. */
const MOMENT_MARKS = { x: 'mm', y: 'N mm' } as const
const FORCE_MARKS = { x: 'mm', y: 'N' } as const

const figures: Record<string, ModelFigure> = {
  tendon: {
    label: 'Tendon profile with the eccentricity limits',
    render: (r) => {
      const d = r as Design
      const s = d.series
      return tendonProfileSvg({ X: s.X, e: s.e, eLimitTop: s.eLimitTop, eLimitBottom: s.eLimitBottom, depth: s.depth, centroid: s.centroid, supportsX: supportMarks(d) })
    },
  },
  'prestress-moments': {
    label: 'Moments of prestress in service: primary, secondary and total',
    marks: MOMENT_MARKS,
    render: (r, _at, marks) => {
      const d = r as Design
      const s = d.series
      return momentDiagramSvg({
        title: 'Moments of prestress in service',
        X: s.X,
        curves: [
          { label: 'primary  M1 = −P e', values: s.primaryService, stroke: PALETTE.olive, dash: 'dashed' },
          { label: 'secondary  M2', values: s.secondaryService, stroke: PALETTE.plum },
          { label: 'total  Mp = M1 + M2', values: s.totalService, stroke: PALETTE.blue },
        ],
        supportsX: supportMarks(d),
        unit: 'kNm',
        marks: plotted(marks, 1e6),
      })
    },
  },
  moments: {
    label: 'Moments from the loads: characteristic envelope over the load arrangements, and at transfer',
    marks: MOMENT_MARKS,
    render: (r, _at, marks) => {
      const d = r as Design
      const s = d.series
      return momentDiagramSvg({
        title: 'Bending moments from the loads',
        X: s.X,
        band: { label: 'characteristic envelope', min: s.momentServiceMin, max: s.momentServiceMax },
        curves: [
          { label: 'characteristic, greatest', values: s.momentServiceMax, stroke: PALETTE.blue },
          { label: 'characteristic, least', values: s.momentServiceMin, stroke: PALETTE.blue, dash: 'dashed' },
          { label: 'at transfer', values: s.momentTransfer, stroke: PALETTE.sand },
        ],
        supportsX: supportMarks(d),
        unit: 'kNm',
        loads: addedLoadMarks(d),
        marks: plotted(marks, 1e6),
      })
    },
  },
  'uls-moments': {
    label: 'Design moments at ULS (envelope over the load arrangements) against the bending resistance, sagging and hogging',
    marks: MOMENT_MARKS,
    render: (r, _at, marks) => {
      const d = r as Design
      const s = d.series
      return ulsMomentSvg({
        X: s.X,
        max: s.momentUlsMax,
        min: s.momentUlsMin,
        sagging: d.uls.sections.map((u) => (u.sagging ? { X: u.X, value: u.sagging.MRd } : null)),
        hogging: d.uls.sections.map((u) => (u.hogging ? { X: u.X, value: -u.hogging.MRd } : null)),
        supportsX: supportMarks(d),
        unit: 'kNm',
        marks: plotted(marks, 1e6),
      })
    },
  },
  'uls-shear': {
    label: 'Design shear at ULS (envelope over the load arrangements) against the shear resistance at the supports',
    marks: FORCE_MARKS,
    render: (r, _at, marks) => {
      const d = r as Design
      const s = d.series
      const starts = supportsX(d)
      return ulsShearSvg({
        X: s.X,
        max: s.shearUlsMax,
        min: s.shearUlsMin,
        resistances: d.uls.shear.map((v) => {
          const k = s.X.findIndex((_, i) => s.span[i] === v.span && Math.abs((s.x[i] as number) - v.x) < 1e-6)
          // VRd drawn on the side of the axis where the design shear it is checked against lies
          const negative = k >= 0 && Math.abs(s.shearUlsMin[k] as number) > Math.abs(s.shearUlsMax[k] as number)
          return { X: (starts[v.span] as number) + v.x, value: negative ? -v.VRd : v.VRd, toward: v.side }
        }),
        supportsX: supportMarks(d),
        unit: 'kN',
        marks: plotted(marks, 1e3),
      })
    },
  },
  'stresses-transfer': stressFigure('Transfer', 'at transfer'),
  'stresses-service': stressFigure('Service', 'in service'),
  force: {
    label: 'Force along the tendon after friction, draw-in, at transfer and in service',
    marks: FORCE_MARKS,
    render: (r, _at, marks) => {
      const d = r as Design
      const s = d.series
      return forceAlongTendonSvg({
        X: s.X,
        curves: [
          { label: 'after friction', values: s.forceFriction, stroke: PALETTE.axis, dash: 'dashed' },
          { label: 'after draw-in', values: s.forceDrawIn, stroke: PALETTE.sand },
          { label: 'at transfer', values: s.forceTransfer, stroke: PALETTE.blue },
          { label: 'in service', values: s.forceService, stroke: PALETTE.olive },
        ],
        supportsX: supportMarks(d),
        marks: plotted(marks, 1e3),
      })
    },
  },
  deflection: {
    label: 'Deflection under the quasi-permanent unbalanced load, short-term and long-term',
    marks: { x: 'mm', y: 'mm' },
    render: (r, _at, marks) => {
      const d = r as Design
      const s = d.deflection.series
      return deflectionSvg({ X: s.x, shortTerm: s.shortTerm, longTerm: s.longTerm, supportsX: supportMarks(d), marks: plotted(marks, 1) })
    },
  },
  magnel: {
    label: 'Magnel diagram of a section',
    at: 'sections[]',
    render: (r, at) => {
      const d = r as Design
      const section = sectionAt(d, at)
      if (!section) return ''
      const m = section.magnel
      return magnelSvg({
        title: `Magnel diagram, ${section.label}`,
        lines: m.lines,
        region: m.region,
        eLimits: m.eLimits,
        least: m.minP !== null && m.minP > 0 && m.eAtMinP !== null ? { e: m.eAtMinP, invP: 1 / m.minP } : null,
        design: section.force.transfer > 0 ? { e: section.e, invP: 1 / section.force.transfer } : null,
      })
    },
  },
}

// The shape of a Design does not depend on the numbers: the demo runs, and one with every optional part, show every key.
let shape: Map<string, ShapeKind> | null = null
function resultShape(): Map<string, ShapeKind> {
  if (!shape) {
    const s = shapeOf(designMember(DEMO_PS2))
    shapeOf(designMember(DEMO_BB1), s)
    // the optional parts (columns, fire, point and line loads, drops, a cantilever) have their keys whether or not a demo sheet uses them
    shapeOf(designMember({
      ...DEMO_PS2, columns: { where: 'all' }, fire: { rating: 'R60' }, section: { ...DEMO_PS2.section, drops: [{ support: 2, left: 1500, right: 1500, depth: 150 }] },
      loads: { ...DEMO_PS2.loads, points: [{ span: 1, at: 1000, P: 1000 }], lines: [{ span: 1, at: 2000, w: 1 }], partials: [{ span: 1, from: 0, length: 1000, q: 1e-3 }] },
    }, { proposal: false }), s)
    shape = s
  }
  return shape
}

/** Check groups: those the engine documents, and any the demo runs produce. */
let groups: string[] | null = null
function checkGroups(): string[] {
  if (!groups) {
    const found = new Set(['transfer', 'service', 'precompression', 'tendon', 'balancing', 'uls', 'detailing', 'sls', 'fire', 'site', 'own'])
    for (const demo of [DEMO_PS2, DEMO_BB1]) for (const c of designMember(demo).checks) found.add(c.group)
    groups = [...found].sort()
  }
  return groups
}

/** Words for the check groups of pt-member. */
const GROUP_LABELS: Record<string, string> = {
  transfer: 'Stresses at transfer',
  service: 'Stresses in service',
  tendon: 'Tendon stress',
  precompression: 'Average precompression',
  balancing: 'Load balancing',
  uls: 'Ultimate limit state',
  detailing: 'Detailing',
  sls: 'Deflection and cracking',
  site: 'Measured extensions',
  fire: 'Fire resistance',
  own: 'The engineer\'s own checks',
}

/** What a checker compares first between two revisions: the force, its losses, the stresses' inputs, the results that govern. */
const GOVERNING_KEYS = [
  'section.A', 'section.I', 'loads.selfWeight', 'loads.balanced',
  'profile.drapes[]', 'balancing.governing', 'balancing.strandsProvided', 'balancing.balancedProvided[]',
  'jacking.strands', 'jacking.Pjack', 'force.meanTransfer', 'force.meanService', 'force.eta', 'force.drawInLength',
  'losses.phi', 'losses.epsCs', 'precompression.transfer', 'precompression.service',
  'prestressMoments.service.secondary[]', 'uls.sections[].MEdMax', 'uls.sections[].MEdMin', 'uls.shear[].VEd', 'uls.shear[].VRd',
  'deflection.spans[].longTerm.value', 'cracking.sections[].wk',
] as const

/** The model with its input schema (zod), for the editor's form and for parsing uploaded inputs. */
export const ptMemberModel: ReportModel & { inputSchema: typeof memberInputSchema } = {
  id: 'pt-member',
  inputSchema: memberInputSchema,
  label: 'Post-tensioned continuous member (EN 1992-1-1)',
  inputFields: inputFieldSpecs(),
  inputGroups: INPUT_GROUPS,
  resultSpecs: RESULT_SPECS,
  resultSpec: (pattern) => specFor(pattern),
  get resultShape() {
    return resultShape()
  },
  get checkGroups() {
    return checkGroups()
  },
  figures,
  groupLabels: GROUP_LABELS,
  overview: (r) => memberOverview(r as Design),
  governingKeys: GOVERNING_KEYS,
  inputApplies: isRelevant,
  checksOf: (r) => (r as Design).checks,
  inputOf: (r) => (r as Design).input,
  run: (inputs) => designMember(inputs),
}

/** Models by the name templates give in their front matter. */
export const MODELS: Readonly<Record<string, ReportModel>> = { 'pt-member': ptMemberModel }
