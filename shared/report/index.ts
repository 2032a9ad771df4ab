/**
 * The template language and renderer: parse → bind to a model → HTML with SVG figures.
 * Pure TypeScript; the same code runs in the editor, the frozen view and print.
 */
export { TemplateError, TemplateKeyError, TemplateLoadError, TemplateSyntaxError } from './errors'
export { parseTemplate, templateMetaSchema } from './parse'
export type { ParsedTemplate, TemplateMeta } from './parse'
export { compileTemplate, lintTemplate } from './compile'
export type { CompiledTemplate } from './compile'
export { REPORT_CAUTION, renderReport, renderReportParts } from './render'
export type { RenderedReport, RenderedReportParts, ReportPart, RenderMode, RenderOptions, ReportCheck, ReportSection, UnresolvedKey } from './render'
export { shapeOf } from './model'
export type { ModelFigure, ModelInputField, ReportModel, ShapeKind } from './model'
export { describeKey } from './bind'
export type { KeyInfo } from './bind'
export { BLOCK_DIRECTIVES, INLINE_DIRECTIVES, parseKey } from './syntax'
export { MODELS, ptMemberModel } from './models'
export { BUILTIN_TEMPLATES, TEMPLATE_LANGUAGE_DOC, builtinTemplate } from './builtins/index'
export type { BuiltinId, BuiltinTemplate } from './builtins/index'
export { templateLanguageHelpHtml } from './help'
