// HTML built only through the `html` template, which escapes every interpolated value unless it is
// already SafeHtml. Values from the data can therefore never become markup, attributes or links.

/** Markup known to be safe: produced by `html`, the chart builders or `trusted` on a literal. */
export class SafeHtml {
  readonly value: string;
  constructor(value: string) {
    this.value = value;
  }
  toString(): string {
    return this.value;
  }
}

/** Anything `html` accepts between `${}`: text and numbers are escaped, SafeHtml kept, arrays joined. */
export type HtmlValue = SafeHtml | string | number | boolean | null | undefined | readonly HtmlValue[];

const ENTITIES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;', '`': '&#96;' };

/**
 * Escapes text for HTML and SVG text and for quoted attribute values (the five XML specials plus the
 * backtick). Characters that are not allowed in an HTML/XML document (C0 controls other than tab, line
 * feed and carriage return; lone surrogates; U+FFFE/U+FFFF) become U+FFFD so the file stays well formed
 * (WHATWG HTML §13.1.2 "noncharacters and controls"; XML 1.0 §2.2 Char).
 */
export function escapeHtml(text: string): string {
  return text
    .replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f\ufffe\uffff]|[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/g, '\ufffd')
    .replace(/[&<>"'`]/g, (ch) => ENTITIES[ch]);
}

function render(value: HtmlValue): string {
  if (value === null || value === undefined || value === false) return '';
  if (value instanceof SafeHtml) return value.value;
  if (Array.isArray(value)) return value.map(render).join('');
  return escapeHtml(String(value));
}

/**
 * Tagged template for markup: `html\`<td>${cell}</td>\`` escapes `cell`. Use it for every piece of HTML or
 * SVG; the literal parts are the only markup that is not escaped.
 */
export function html(strings: TemplateStringsArray, ...values: HtmlValue[]): SafeHtml {
  let out = strings[0];
  for (let i = 0; i < values.length; i++) out += render(values[i]) + strings[i + 1];
  return new SafeHtml(out);
}

/** Joins pieces of markup (escaping any plain text among them). */
export function joinHtml(parts: readonly HtmlValue[], separator = ''): SafeHtml {
  return new SafeHtml(parts.map(render).join(separator));
}

/** Marks a string of the program's own making (CSS, a path's d attribute) as markup. Never pass data. */
export function trusted(markup: string): SafeHtml {
  return new SafeHtml(markup);
}

/**
 * True when a text, pasted into a spreadsheet, would be read as a formula (OWASP "CSV Injection"): it starts
 * with = or @ (or a tab or carriage return, or their full-width forms), or with + or - followed by a name, a
 * bracket or a pipe. Plain signed numbers and offsets such as -06:00 are not formulas.
 */
export function looksLikeFormula(text: string): boolean {
  const t = text.replace(/^[ \u00a0]+/, '');
  if (/^[=@\t\r\uff1d\uff20]/.test(text) || /^[=@\uff1d\uff20]/.test(t)) return true;
  return /^[+\-\uff0b\uff0d]\s*[A-Za-z_(\[{"']/.test(t) || (/^[+\-\uff0b\uff0d]/.test(t) && /[|!]/.test(t));
}

/**
 * A value from the data as inert text. Text that a spreadsheet would run as a formula is shown with a
 * leading apostrophe (OWASP's advice for cells copied into spreadsheets) and a marker class, so copying the
 * report's tables into a spreadsheet cannot run it either.
 */
export function dataText(text: string): SafeHtml {
  if (!looksLikeFormula(text)) return new SafeHtml(escapeHtml(text));
  return html`<span class="q-guard" title="starts like a spreadsheet formula; shown as text">'${text}</span>`;
}

/** A stable id for an element, made only of safe characters, from a prefix and any text. */
export function makeId(prefix: string, text: string): string {
  let h = 2166136261;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 16777619);
  const slug = text.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 24);
  return `${prefix}-${slug || 'x'}-${(h >>> 0).toString(36)}`;
}
