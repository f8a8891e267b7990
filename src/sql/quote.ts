// Quoting for emitted SQL. The policy, in one place:
// - identifiers (a column or table named by the user) are split on '.' and every part is quoted as an
//   identifier of the dialect ("part" with "" doubled; Spark `part` with `` doubled), so a name can never
//   end the identifier and start SQL of its own;
// - strings (labels, zone names) are always literals: quotes are doubled, and a string that holds a
//   backslash or a control character is written in a form with no escape ambiguity (PostgreSQL E'…' with
//   backslashes doubled; Spark a hex literal decoded as UTF-8, because Spark reads backslash escapes in '…');
// - numbers are written as plain decimals after a finiteness check;
// - a raw column expression (`columnExpr`) is trusted text by definition; it is only checked for the
//   mistakes that would break out of the surrounding query (';', an unbalanced parenthesis or quote, a
//   comment start), which catches accidents, not a determined author.
import { QuernError } from '../errors.js';

/** The SQL dialects quern writes. */
export type DialectName = 'duckdb' | 'postgres' | 'spark' | 'trino';

export const DIALECTS: readonly DialectName[] = ['duckdb', 'postgres', 'spark', 'trino'];

/** Parses a dialect name, throwing QuernError E_USAGE with the list of dialects otherwise. */
export function parseDialect(text: string): DialectName {
  const name = text.trim().toLowerCase();
  if (name === 'postgresql' || name === 'pg') return 'postgres';
  if ((DIALECTS as readonly string[]).includes(name)) return name as DialectName;
  throw new QuernError('E_USAGE', `unknown SQL dialect "${text}"`, `use one of ${DIALECTS.join(', ')}`);
}

function rejectNul(text: string, what: string): void {
  if (text.includes('\u0000')) throw new QuernError('E_VALUE', `${what} holds a NUL character`, 'remove it');
}

/** Quotes one identifier part for `dialect` (case is kept exactly as written). */
export function quoteIdentifier(part: string, dialect: DialectName): string {
  rejectNul(part, 'an identifier');
  if (part.length === 0) throw new QuernError('E_USAGE', 'an empty identifier', 'name a column or table');
  if (dialect === 'spark') return `\`${part.replace(/`/g, '``')}\``;
  return `"${part.replace(/"/g, '""')}"`;
}

/** Quotes a name or dotted name (`schema.table`, `t.visit_time`) part by part. */
export function quoteName(name: string, dialect: DialectName): string {
  const parts = name.split('.');
  if (parts.some((p) => p.trim().length === 0)) {
    throw new QuernError('E_USAGE', `"${name}" is not a name or dotted name`, 'write name or schema.name; use --column-expr for an expression');
  }
  return parts.map((p) => quoteIdentifier(p, dialect)).join('.');
}

// eslint-disable-next-line no-control-regex
const NEEDS_CARE = /[\\\u0000-\u001f\u007f]/;

/** Writes `text` as a string literal of `dialect` that means exactly `text`. */
export function quoteString(text: string, dialect: DialectName): string {
  rejectNul(text, 'a string');
  const doubled = text.replace(/'/g, "''");
  if (!NEEDS_CARE.test(text)) return `'${doubled}'`;
  if (dialect === 'postgres') return `E'${text.replace(/\\/g, '\\\\').replace(/'/g, "''")}'`;
  if (dialect === 'spark') return `decode(X'${Buffer.from(text, 'utf8').toString('hex').toUpperCase()}', 'UTF-8')`;
  return `'${doubled}'`; // DuckDB and Trino read no backslash escapes in standard literals
}

/** Writes a finite number as a plain SQL decimal (never in exponent form). */
export function numberLiteral(value: number): string {
  if (!Number.isFinite(value)) throw new QuernError('E_VALUE', `${value} is not a finite number`, 'use null for an open end');
  if (Number.isInteger(value)) return BigInt(value).toString();
  const text = String(value);
  if (!/e/i.test(text)) return text;
  // Expand exponent notation exactly from the shortest round-trip digits.
  const [mant, expText] = text.toLowerCase().split('e') as [string, string];
  const neg = mant.startsWith('-');
  const digits = mant.replace('-', '').replace('.', '');
  const point = (mant.replace('-', '').indexOf('.') === -1 ? mant.replace('-', '').length : mant.replace('-', '').indexOf('.')) + Number(expText);
  const body = point <= 0 ? `0.${'0'.repeat(-point)}${digits}` : `${digits.slice(0, point)}.${digits.slice(point)}`;
  return `${neg ? '-' : ''}${body.replace(/\.$/, '')}`;
}

/**
 * Checks a trusted raw SQL expression for the slips that would break out of the query around it
 * (';', unbalanced parentheses or quotes, a comment) and returns it in parentheses.
 */
export function checkRawExpression(expr: string): string {
  rejectNul(expr, 'a column expression');
  let depth = 0;
  let quote: string | null = null;
  for (let i = 0; i < expr.length; i++) {
    const ch = expr[i]!;
    if (quote !== null) {
      if (ch === quote) {
        if (expr[i + 1] === quote) i++;
        else quote = null;
      }
      continue;
    }
    if (ch === "'" || ch === '"' || ch === '`') quote = ch;
    else if (ch === '(') depth++;
    else if (ch === ')') depth--;
    else if (ch === ';') throw rawError(expr, 'holds ";"');
    else if ((ch === '-' && expr[i + 1] === '-') || (ch === '/' && expr[i + 1] === '*')) throw rawError(expr, 'holds a comment');
    if (depth < 0) throw rawError(expr, 'closes a parenthesis it did not open');
  }
  if (quote !== null) throw rawError(expr, 'leaves a quote open');
  if (depth !== 0) throw rawError(expr, 'leaves a parenthesis open');
  if (expr.trim().length === 0) throw new QuernError('E_USAGE', 'an empty column expression', 'write an expression');
  return `(${expr.trim()})`;
}

function rawError(expr: string, why: string): QuernError {
  return new QuernError('E_USAGE', `the column expression ${JSON.stringify(expr)} ${why}`, 'write one SQL expression; name a plain column with --column');
}
