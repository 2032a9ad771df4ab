/**
 * Errors of the template language. A template is checked as a whole and every problem is
 * collected, so that the author sees all of them at once, each with the line it is on (1-based,
 * counted in the whole template text including its front matter).
 */

/** One problem in a template. */
export class TemplateError extends Error {
  readonly line: number
  /** the problem without its line, for a list that shows the line in a column of its own */
  readonly detail: string
  constructor(line: number, message: string) {
    super(`line ${line}: ${message}`)
    this.name = 'TemplateError'
    this.line = line
    this.detail = message
  }
}

/** Malformed template text: an unknown directive, a bad attribute, an unclosed block, bad front matter. */
export class TemplateSyntaxError extends TemplateError {
  constructor(line: number, message: string) {
    super(line, message)
    this.name = 'TemplateSyntaxError'
  }
}

/** A key that the bound model does not have (or has, but not of the kind the directive needs). */
export class TemplateKeyError extends TemplateError {
  readonly key: string
  constructor(line: number, key: string, message: string) {
    super(line, message)
    this.name = 'TemplateKeyError'
    this.key = key
  }
}

/** Thrown by compileTemplate: the template cannot be loaded; `errors` lists every problem, by line. */
export class TemplateLoadError extends Error {
  readonly errors: readonly TemplateError[]
  constructor(errors: readonly TemplateError[]) {
    const sorted = [...errors].sort((a, b) => a.line - b.line)
    super(`the template cannot be loaded:\n${sorted.map((e) => `  ${e.message}`).join('\n')}`)
    this.name = 'TemplateLoadError'
    this.errors = sorted
  }
}
