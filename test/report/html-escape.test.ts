import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { dataText, escapeHtml, html, joinHtml, looksLikeFormula, makeId, SafeHtml, trusted } from '../../src/report/html/escape.js';
import { renderPage, REPORT_CSP } from '../../src/report/html/page.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 300);

describe('escapeHtml(text)', () => {
  it.each([
    // OWASP XSS Prevention Cheat Sheet, rule #1/#2: encode & < > " ' (and ` for old IE attribute parsing)
    ['<script>alert(1)</script>', '&lt;script&gt;alert(1)&lt;/script&gt;'],
    ['<img src=x onerror=alert(1)>', '&lt;img src=x onerror=alert(1)&gt;'],
    ['" onmouseover="alert(1)', '&quot; onmouseover=&quot;alert(1)'],
    ["' autofocus onfocus='x", '&#39; autofocus onfocus=&#39;x'],
    ['`x`', '&#96;x&#96;'],
    ['Tom & Jerry', 'Tom &amp; Jerry'],
    ['&amp;', '&amp;amp;'],
    ['javascript:alert(1)', 'javascript:alert(1)'], // inert as text: quern never writes an href from data
  ])('escapeHtml(%j) is %j', (input, out) => {
    expect(escapeHtml(input)).toBe(out);
  });

  it.each([
    // XML 1.0 §2.2: C0 controls other than tab, LF, CR are not characters of a document
    ['a\u0000b', 'a\ufffdb'],
    ['a\u001bb', 'a\ufffdb'],
    ['tab\tnl\ncr\r', 'tab\tnl\ncr\r'],
    // a lone surrogate cannot be encoded in UTF-8 (Unicode §3.9); a pair is kept
    ['x\ud800y', 'x\ufffdy'],
    ['x\udc00y', 'x\ufffdy'],
    ['😀', '😀'],
  ])('escapeHtml(%j) keeps the document well formed: %j', (input, out) => {
    expect(escapeHtml(input)).toBe(out);
  });

  it('escapeHtml(any) never leaves a raw < > " \' or a & that does not start an entity', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: 0xffff }), { maxLength: 40 }).map((codes) => String.fromCharCode(...codes)), (s) => {
        const e = escapeHtml(s);
        return !/[<>"'`]/.test(e) && !/&(?!(amp|lt|gt|quot|#39|#96);)/.test(e);
      }),
      { numRuns: RUNS },
    );
  });
});

describe('html`...` template', () => {
  it('html`<td>${value}</td>` escapes text and numbers, keeps SafeHtml, joins arrays', () => {
    const cell = html`<b>${'<i>'}</b>`;
    const out = html`<td>${'<x>'}</td><td>${42}</td>${cell}${['<a>', html`<br>`]}${null}${undefined}${false}`;
    expect(out).toBeInstanceOf(SafeHtml);
    expect(out.value).toBe('<td>&lt;x&gt;</td><td>42</td><b>&lt;i&gt;</b>&lt;a&gt;<br>');
  });

  it('html`<p title="${value}">` escapes quotes so a value cannot leave the attribute', () => {
    const out = html`<p title="${'" onclick="alert(1)'}">x</p>`.value;
    expect(out).toBe('<p title="&quot; onclick=&quot;alert(1)">x</p>');
  });

  it('joinHtml(parts, sep) escapes plain strings among the parts', () => {
    expect(joinHtml(['<a>', trusted('<b>')], ',').value).toBe('&lt;a&gt;,<b>');
  });
});

describe('looksLikeFormula(text) and dataText(text)', () => {
  it.each([
    // OWASP "CSV Injection": cells starting with = + - @ (or tab, carriage return) run as formulas
    ['=HYPERLINK("http://example.invalid","x")', true],
    ['=1+1', true],
    ['@SUM(A1:A2)', true],
    ['+cmd|\' /C calc\'!A0', true],
    ['-cmd|\' /C calc\'!A0', true],
    ['\t=1', true],
    ['  =1', true],
    ['＝1', true], // full-width equals sign, read as = by spreadsheet input methods (from memory)
    // plain numbers and offsets are data, not formulas (common practice)
    ['-5', false],
    ['+3.5', false],
    ['-06:00', false],
    ['1e-3', false],
    ['Alderbrook', false],
    ['', false],
  ])('looksLikeFormula(%j) is %s', (text, expected) => {
    expect(looksLikeFormula(text)).toBe(expected);
  });

  it('dataText(formula) shows a leading apostrophe and marks the cell', () => {
    const out = dataText('=HYPERLINK("x")').value;
    expect(out).toContain('class="q-guard"');
    expect(out).toContain("'=HYPERLINK(&quot;x&quot;)");
    expect(dataText('plain <b>').value).toBe('plain &lt;b&gt;');
  });
});

describe('makeId(prefix, text)', () => {
  it('makeId(prefix, hostile text) gives only safe characters and differs for different texts', () => {
    const a = makeId('c', '"><script>');
    expect(a).toMatch(/^[a-z0-9-]+$/);
    expect(makeId('c', 'A B')).not.toBe(makeId('c', 'A-B'));
    expect(makeId('c', 'same')).toBe(makeId('c', 'same'));
  });
});

describe('renderPage(options)', () => {
  const page = renderPage({ command: 'test', title: '<script>alert(1)</script>', body: html`<p>${'<img src=x onerror=alert(1)>'}</p>`, facts: [['Rows', '<b>1</b>']] });

  it('renderPage(...) is one self-contained document: CSP, inline style, no script, no external URL', () => {
    expect(page.startsWith('<!DOCTYPE html>')).toBe(true);
    expect(page).toContain(`<meta http-equiv="Content-Security-Policy" content="${escapeHtml(REPORT_CSP)}">`);
    expect(REPORT_CSP).toContain("default-src 'none'"); // W3C CSP Level 3: nothing loads unless allowed
    expect(page).toContain('<style>');
    expect(page).not.toMatch(/<script/i);
    expect(page).not.toMatch(/<link\b|@import|url\(\s*['"]?https?:/i);
    expect(page).not.toMatch(/(src|href)=["']?https?:/i);
  });

  it('renderPage(...) escapes the title, facts and body values', () => {
    expect(page).toContain('<title>&lt;script&gt;alert(1)&lt;/script&gt; · quern test</title>');
    expect(page).toContain('&lt;img src=x onerror=alert(1)&gt;');
    expect(page).toContain('&lt;b&gt;1&lt;/b&gt;');
  });

  it('renderPage(...) carries print rules and a system font stack (no web fonts)', () => {
    expect(page).toContain('@media print');
    expect(page).toContain('system-ui');
    expect(page).not.toContain('@font-face');
  });
});
