/**
 * Spreadsheet formula injection (OWASP "CSV Injection"): a text cell starting with = + - @, a tab or
 * a carriage return would run as a formula when the CSV is opened in a spreadsheet. Such a cell is
 * written with a leading ' (shown as text) and the ' is taken off again when our own CSV is read
 * back. Numbers are written as numbers (a negative value is a value, not a formula).
 * Papa's own `escapeFormulae: true` pattern ends in `.*$`, which misses a cell with a line break
 * after the formula, hence this pattern of the first character alone.
 */
export const CSV_FORMULA_START = /^[=+\-@\t\r]/

/** A cell as it was before export escaped it. */
export function unescapeCsvCell(cell: string) {
  return cell.startsWith('\'') && CSV_FORMULA_START.test(cell.slice(1)) ? cell.slice(1) : cell
}
