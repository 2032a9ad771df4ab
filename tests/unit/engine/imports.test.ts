/**
 * The engine's modules import one another without a cycle: a stage may import leaf modules,
 * common/, input/ and the result types of earlier stages, never a later stage. The relative imports
 * of every file under shared/engine are read with TypeScript's own parser (type-only imports count:
 * they tie the modules together just as much) and the graph is searched depth first.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs'
import { dirname, join, relative, resolve } from 'node:path'
import { fileURLToPath } from 'node:url'
import ts from 'typescript'
import { describe, expect, it } from 'vitest'

const ENGINE = resolve(dirname(fileURLToPath(import.meta.url)), '../../../shared/engine')

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = join(dir, name)
    return statSync(p).isDirectory() ? sourceFiles(p) : p.endsWith('.ts') ? [p] : []
  })
}

/** The engine files a file imports or re-exports by a relative path. */
function relativeImports(file: string): string[] {
  const sf = ts.createSourceFile(file, readFileSync(file, 'utf8'), ts.ScriptTarget.ES2022, false)
  const out: string[] = []
  for (const st of sf.statements) {
    const spec = (ts.isImportDeclaration(st) || ts.isExportDeclaration(st)) ? st.moduleSpecifier : undefined
    if (!spec || !ts.isStringLiteral(spec) || !spec.text.startsWith('.')) continue
    const target = resolve(dirname(file), spec.text)
    const candidates = [`${target}.ts`, join(target, 'index.ts')]
    const found = candidates.find((c) => c.startsWith(ENGINE) && statSync(c, { throwIfNoEntry: false })?.isFile())
    if (found) out.push(found)
  }
  return out
}

/** Every cycle found by a depth-first search, as a list of paths relative to shared/engine. */
function cycles(graph: Map<string, string[]>): string[][] {
  const found: string[][] = []
  const state = new Map<string, 'open' | 'done'>()
  const stack: string[] = []
  const visit = (f: string): void => {
    state.set(f, 'open')
    stack.push(f)
    for (const g of graph.get(f) ?? []) {
      if (state.get(g) === 'open') found.push([...stack.slice(stack.indexOf(g)), g].map((p) => relative(ENGINE, p)))
      else if (!state.has(g)) visit(g)
    }
    stack.pop()
    state.set(f, 'done')
  }
  for (const f of graph.keys()) if (!state.has(f)) visit(f)
  return found
}

describe('import graph of shared/engine', () => {
  const files = sourceFiles(ENGINE)
  const graph = new Map(files.map((f) => [f, relativeImports(f)]))

  it('reads the relative imports of every engine file', () => {
    expect(files.length).toBeGreaterThan(40)
    expect(graph.get(join(ENGINE, 'member/design.ts'))).toContain(join(ENGINE, 'member/service-design.ts'))
  })

  it('has no import cycle', () => {
    expect(cycles(graph)).toEqual([])
  })

  it('finds a cycle where there is one (the search itself, on a made-up graph)', () => {
    const made = new Map([[join(ENGINE, 'a.ts'), [join(ENGINE, 'b.ts')]], [join(ENGINE, 'b.ts'), [join(ENGINE, 'a.ts')]]])
    expect(cycles(made)).toEqual([['a.ts', 'b.ts', 'a.ts']])
  })

  it('leaf formula modules never import the member stages', () => {
    const leaves = files.filter((f) => !/[/\\](member|input|results)[/\\]|index\.ts$/.test(relative(ENGINE, f)) && !relative(ENGINE, f).startsWith('member'))
    for (const f of leaves) for (const g of graph.get(f) ?? []) expect(relative(ENGINE, g), relative(ENGINE, f)).not.toMatch(/^member\//)
  })
})
