/**
 * The SVG figures: plain, inert, deterministic SVG with coordinates rounded to 0.1, axes labelled
 * with units, and geometry that matches the data it draws (checked by inverting the scales, and the
 * Magnel line clipping against the line equation on seeded random lines).
 */
import { describe, expect, it } from 'vitest'
import { DEMO_BB1, DEMO_PS2 } from '../../../shared/engine/input/demo'
import { designMember } from '../../../shared/engine/member/design'
import type { Design } from '../../../shared/engine/member/design'
import { clipLine, magnelSvg } from '../../../shared/report/figures/magnel'
import { tendonProfileSvg } from '../../../shared/report/figures/tendon'
import { n } from '../../../shared/report/figures/svg'
import { ptMemberModel } from '../../../shared/report/models'
import { compileTemplate } from '../../../shared/report/compile'
import { renderReport } from '../../../shared/report/render'
import { startTags } from './helpers'
import { prng } from '../../helpers/prng'

const SVG_TAGS = new Set(['svg', 'title', 'g', 'path', 'line', 'rect', 'text', 'circle'])
const DESIGNS: Record<string, Design> = { 'PS-2': designMember(DEMO_PS2), 'BB-1': designMember(DEMO_BB1) }

function numbersIn(svg: string): string[] {
  const out: string[] = []
  for (const tag of startTags(svg)) {
    for (const a of tag.attrs) {
      if (['d', 'x', 'y', 'x1', 'x2', 'y1', 'y2', 'cx', 'cy', 'r', 'width', 'height'].includes(a.name)) out.push(...(a.value.match(/-?\d+(?:\.\d+)?(?:e-?\d+)?/g) ?? []))
    }
  }
  return out
}

describe.each(Object.entries(ptMemberModel.figures))('figure %s', (name, figure) => {
  it.each(Object.keys(DESIGNS))('draws demo sheet %s as inert, deterministic SVG', (sheet) => {
    const svg = figure.render(DESIGNS[sheet], undefined)
    expect(svg.startsWith('<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true)
    expect(svg.endsWith('</svg>')).toBe(true)
    for (const tag of startTags(svg)) {
      expect(SVG_TAGS.has(tag.name), `<${tag.name}>`).toBe(true)
      for (const a of tag.attrs) {
        expect(a.name.startsWith('on') || a.name === 'href' || a.name === 'xlink:href' || a.name === 'style' || a.name === 'id', `${name}: ${a.name}`).toBe(false)
        expect(a.value).not.toMatch(/url\(|javascript:/i)
      }
    }
    for (const v of numbersIn(svg)) expect(v, `${name}: ${v}`).toMatch(/^-?\d+(\.\d)?$/)
    expect(svg).not.toMatch(/NaN|Infinity|undefined/)
    expect(figure.render(designMember(sheet === 'PS-2' ? DEMO_PS2 : DEMO_BB1), undefined)).toBe(svg)
  })
})

describe('a figure of one element', () => {
  it('draws the Magnel diagram of the section an each block stands at', () => {
    const text = '---\nmodel: pt-member\ntitle: t\nversion: 1\n---\n::: each{in=sections as=s where=s.kind is=lowPoint}\n::: figure{plot=magnel at=s}\n:val[s.label]\n:::\n:::\n'
    const design = DESIGNS['PS-2']!
    const report = renderReport(compileTemplate(text, ptMemberModel), { inputs: DEMO_PS2, results: design, mode: 'print' })
    const lows = design.sections.filter((s) => s.kind === 'lowPoint').map((s) => s.label)
    expect([...report.html.matchAll(/aria-label="Magnel diagram, ([^"]+)"/g)].map((m) => m[1])).toEqual(lows)
    expect(report.unresolved).toEqual([])
  })
})

describe('axis labels carry units', () => {
  it.each([
    ['tendon', ['distance along the member (m)', 'depth below top (mm)', 'vertical scale ×']],
    ['moments', ['M (kNm), sagging + below']],
    ['prestress-moments', ['M (kNm), sagging + below', 'secondary  M2']],
    ['stresses-transfer', ['σ (MPa), compression +']],
    ['stresses-service', ['σ (MPa), compression +']],
    ['force', ['P (kN)']],
    ['magnel', ['e (mm), below the centroid +', '1/P (1/MN)', 'feasible region', 'least force']],
  ])('%s', (name, labels) => {
    const svg = ptMemberModel.figures[name]!.render(DESIGNS['PS-2'], undefined)
    for (const l of labels) expect(svg).toContain(l)
  })
})

describe('geometry', () => {
  it('rounds to 0.1 without a negative zero', () => {
    expect([n(1.26), n(-0.04), n(0), n(12.349), n(-3.25)]).toEqual(['1.3', '0', '0', '12.3', '-3.2'])
  })

  it('draws the tendon at its depth below the top fibre, to the stated exaggeration', () => {
    // a single 10 m span, 250 mm deep, centroid at 125 mm, tendon straight at e = +50 mm
    const X = [0, 2500, 5000, 7500, 10000]
    const flat = (v: number): number[] => X.map(() => v)
    const svg = tendonProfileSvg({ X, e: flat(50), eLimitTop: flat(-80), eLimitBottom: flat(80), depth: flat(250), centroid: flat(125), supportsX: [0, 10000] })
    // frame 720 × 250, margins left 62, right 18, top 30 (+6), bottom 48 (+12): y spans 36 … 190 for 0 … 250 mm
    const yOf = (depth: number): number => 36 + (depth / 250) * (190 - 36)
    const tendon = startTags(svg).find((t) => t.name === 'path' && t.attrs.some((a) => a.name === 'stroke-width' && a.value === '2.2'))!
    const d = tendon.attrs.find((a) => a.name === 'd')!.value
    const ys = [...d.matchAll(/[ML]([\d.]+),([\d.]+)/g)].map((m) => Number(m[2]))
    for (const y of ys) expect(y).toBeCloseTo(yOf(175), 1)
    const xs = [...d.matchAll(/[ML]([\d.]+),([\d.]+)/g)].map((m) => Number(m[1]))
    expect(xs[0]).toBeCloseTo(62, 1)
    expect(xs[xs.length - 1]).toBeCloseTo(720 - 18, 1)
    // exaggeration = (154 px / 250 mm) / (640 px / 10000 mm) = 9.6 → ×10
    expect(svg).toContain('vertical scale ×10')
  })

  it('clips each Magnel line to the box exactly on the line and on the box edges (seeded random lines)', () => {
    const rand = prng(2417)
    const box = { e0: -120, e1: 120, u0: 0, u1: 3e-6 }
    let clipped = 0
    for (let i = 0; i < 500; i += 1) {
      const line = { ae: (rand() - 0.5) * 2e-8, au: (rand() - 0.5) * 20, b: (rand() - 0.5) * 4e-6 }
      const seg = clipLine(line, box)
      if (!seg) continue
      clipped += 1
      for (const p of seg) {
        expect(Math.abs(line.ae * p.e + line.au * p.invP - line.b)).toBeLessThan(1e-12 + 1e-9 * Math.abs(line.b))
        const onEdge = Math.abs(p.e - box.e0) < 1e-6 || Math.abs(p.e - box.e1) < 1e-6 || Math.abs(p.invP - box.u0) < 1e-15 || Math.abs(p.invP - box.u1) < 1e-15
        expect(onEdge).toBe(true)
        expect(p.e).toBeGreaterThanOrEqual(box.e0 - 1e-6)
        expect(p.e).toBeLessThanOrEqual(box.e1 + 1e-6)
      }
    }
    expect(clipped).toBeGreaterThan(50)
    // a line that misses the box entirely
    expect(clipLine({ ae: 0, au: 1, b: 5e-6 }, box)).toBeNull()
  })

  it('marks the least force at the region vertex of largest 1/P (Magnel\'s construction)', () => {
    const section = DESIGNS['PS-2']!.sections.reduce((a, s) => (s.utilisation > a.utilisation ? s : a))
    const m = section.magnel
    expect(m.feasible).toBe(true)
    const top = m.region.reduce((a, p) => (p.invP > a.invP ? p : a))
    expect(1 / m.minP!).toBeCloseTo(top.invP, 12)
    const svg = magnelSvg({ title: 't', lines: m.lines, region: m.region, eLimits: m.eLimits, least: { e: m.eAtMinP!, invP: 1 / m.minP! }, design: null })
    const region = startTags(svg).find((t) => t.name === 'path' && t.attrs.some((a) => a.name === 'fill' && a.value === '#d6e3ec'))!
    const pts = [...region.attrs.find((a) => a.name === 'd')!.value.matchAll(/([\d.]+),([\d.]+)/g)].map((p) => [Number(p[1]), Number(p[2])] as const)
    const highest = pts.reduce((a, p) => (p[1] < a[1] ? p : a))
    const dot = startTags(svg).find((t) => t.name === 'circle')!
    const cx = Number(dot.attrs.find((a) => a.name === 'cx')!.value)
    const cy = Number(dot.attrs.find((a) => a.name === 'cy')!.value)
    expect(cx).toBeCloseTo(highest[0], 0)
    expect(cy).toBeCloseTo(highest[1], 0)
  })
})
