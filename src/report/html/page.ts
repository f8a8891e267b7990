// The page shell: one self-contained HTML file with inline CSS and inline SVG. No scripts, no fonts or
// images fetched; a Content-Security-Policy that forbids scripts and requests even if markup slipped in.
import { html, type HtmlValue, type SafeHtml, trusted } from './escape.js';
import { REPORT_CSS } from './style.js';

/** No script, no network: only inline styles and data: images may load (W3C CSP Level 3 `default-src 'none'`). */
export const REPORT_CSP = "default-src 'none'; style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'none'";

export interface PageOptions {
  /** The command that made the report, e.g. 'profile'. */
  command: string;
  /** Page heading (escaped). */
  title: string;
  /** One or two sentences under the heading: what the reader is looking at. */
  lede?: HtmlValue;
  /** Short facts under the heading ("Rows read: 20,000"). Values are escaped. */
  facts?: ReadonlyArray<readonly [string, HtmlValue]>;
  /** The sections of the report, in order. */
  body: HtmlValue;
  /** Version printed in the footer. */
  version?: string;
  /** An instant to print as "made at"; omitted by default so the same input gives the same file. */
  generatedAt?: string;
}

/** Wraps a report body into a complete, printable, offline HTML document. */
export function renderPage(o: PageOptions): string {
  const facts = o.facts?.length
    ? html`<ul class="q-facts">${o.facts.map(([k, v]) => html`<li><b>${k}:</b> ${v}</li>`)}</ul>`
    : '';
  const made = o.generatedAt ? html` on ${o.generatedAt}` : '';
  const doc = html`<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="${REPORT_CSP}">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="referrer" content="no-referrer">
<meta name="generator" content="quern ${o.version ?? ''}">
<title>${o.title} · quern ${o.command}</title>
<style>${trusted(REPORT_CSS)}</style>
</head>
<body>
<main>
<header class="q-head">
<p class="q-kicker">quern ${o.command} report</p>
<h1>${o.title}</h1>
${o.lede ? html`<p class="q-lede">${o.lede}</p>` : ''}
${facts}
</header>
${o.body}
<footer class="q-foot">Made by quern${o.version ? ` ${o.version}` : ''}${made}. This file runs no scripts and loads nothing from the network; every value from the data is shown as text. Each chart has a table of its numbers beside it.</footer>
</main>
</body>
</html>
`;
  return doc.value;
}

/** A titled section of a report. */
export function section(title: HtmlValue, ...content: HtmlValue[]): SafeHtml {
  return html`<section><h2>${title}</h2>${content}</section>`;
}
