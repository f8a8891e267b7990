// The report's one stylesheet, inlined in every page. Sizes in rem so 200% zoom reflows instead of
// clipping; a system font stack, nothing fetched; print rules that drop scroll boxes and keep figures whole.

/** Colours of the report. Every colour is paired with a shape or pattern in the charts. */
export const PALETTE = {
  ink: '#1d2433',
  muted: '#5b6270',
  paper: '#fcfbf8',
  card: '#ffffff',
  rule: '#d9d4c7',
  bar: '#2f6f8f',
  barSoft: '#a9c6d4',
  missing: '#b03a2e',
  duplicated: '#b57a00',
  filled: '#7d7d7d',
  overlap: '#7b3fa0',
  hole: '#b03a2e',
} as const;

export const REPORT_CSS = `
:root { --ink:${PALETTE.ink}; --muted:${PALETTE.muted}; --paper:${PALETTE.paper}; --card:${PALETTE.card};
  --rule:${PALETTE.rule}; --bar:${PALETTE.bar}; --missing:${PALETTE.missing}; --dup:${PALETTE.duplicated};
  --overlap:${PALETTE.overlap}; }
* { box-sizing: border-box; }
html { font-size: 100%; -webkit-text-size-adjust: 100%; }
body { margin: 0; background: var(--paper); color: var(--ink); line-height: 1.45;
  font-family: system-ui, -apple-system, "Segoe UI", Roboto, "Noto Sans", "Liberation Sans", "DejaVu Sans", sans-serif; }
main { max-width: 76rem; margin: 0 auto; padding: 1.5rem 1.25rem 3rem; }
header.q-head { border-bottom: 3px solid var(--ink); padding-bottom: .75rem; margin-bottom: 1.25rem; }
.q-kicker { font-size: .8rem; letter-spacing: .08em; text-transform: uppercase; color: var(--muted); margin: 0; }
h1 { font-size: 1.75rem; margin: .2rem 0 .35rem; line-height: 1.2; overflow-wrap: anywhere; }
h2 { font-size: 1.3rem; margin: 2rem 0 .5rem; border-bottom: 1px solid var(--rule); padding-bottom: .25rem; overflow-wrap: anywhere; }
h3 { font-size: 1.05rem; margin: 1.25rem 0 .35rem; overflow-wrap: anywhere; }
.q-card h3, .q-multiples h3 { margin-top: 0; }
section > .q-table-box, section > figure { margin-bottom: 1.25rem; }
p { margin: .35rem 0 .75rem; max-width: 48rem; }
.q-lede { font-size: 1.05rem; }
.q-facts { display: flex; flex-wrap: wrap; gap: .35rem 1.5rem; margin: .5rem 0 0; padding: 0; list-style: none; }
.q-facts li { font-size: .92rem; } .q-facts b { font-weight: 600; }
.q-num, table.q-table .q-n { font-variant-numeric: tabular-nums; text-align: right; }
.q-figure { margin: 0 0 1.25rem; display: grid; gap: .75rem 1.25rem; grid-template-columns: minmax(0, 2fr) minmax(min(100%, 16rem), 1fr); align-items: start; }
.q-figure.q-stacked { grid-template-columns: minmax(0, 1fr); margin: 0; }
.q-figure.q-stacked .q-table-box { max-height: 11rem; }
.q-tiles { display: grid; gap: 1.25rem 1.5rem; grid-template-columns: repeat(auto-fill, minmax(min(100%, 24rem), 1fr)); margin-bottom: 1.25rem; }
.q-tiles > figure { break-inside: avoid; }
@media (max-width: 52rem) { .q-figure { grid-template-columns: minmax(0, 1fr); } }
.q-figure figcaption { grid-column: 1 / -1; font-size: .95rem; color: var(--ink); }
.q-figure figcaption b { font-weight: 600; }
svg.q-chart { width: 100%; height: auto; display: block; overflow: visible; font-family: inherit; }
svg.q-chart text { fill: var(--ink); font-size: 11px; }
svg.q-chart .q-axis text { fill: var(--muted); font-size: 10px; }
svg.q-chart .q-axis line, svg.q-chart .q-axis path { stroke: var(--rule); }
.q-table-box { max-height: 22rem; overflow: auto; border: 1px solid var(--rule); background: var(--card); }
.q-table-box:focus { outline: 3px solid var(--bar); outline-offset: 2px; }
table.q-table { border-collapse: collapse; width: 100%; font-size: .85rem; }
table.q-table caption { text-align: left; font-weight: 600; padding: .4rem .5rem; caption-side: top; }
table.q-table th, table.q-table td { padding: .2rem .5rem; border-bottom: 1px solid #ece8de; text-align: left; vertical-align: top; overflow-wrap: break-word; }
table.q-table .q-n { white-space: nowrap; }
table.q-table thead th { position: sticky; top: 0; background: #f3f0e8; border-bottom: 1px solid var(--rule); }
table.q-table tr.q-flag td { background: #fff4e0; }
.q-cards { display: grid; gap: 1rem; grid-template-columns: repeat(auto-fill, minmax(min(100%, 22rem), 1fr)); }
.q-card { background: var(--card); border: 1px solid var(--rule); border-radius: 6px; padding: .9rem 1rem; break-inside: avoid; }
.q-card .q-figure { grid-template-columns: minmax(0, 1fr); margin: .5rem 0 0; }
.q-card .q-table-box { max-height: 12rem; }
.q-badges { display: flex; flex-wrap: wrap; gap: .35rem; margin: .15rem 0 .5rem; padding: 0; list-style: none; }
.q-badge { display: inline-block; border: 1px solid var(--ink); border-radius: 999px; padding: 0 .55rem; font-size: .8rem; }
.q-badge::before { content: attr(data-mark) " "; }
.q-multiples { display: grid; gap: 1rem; grid-template-columns: repeat(auto-fill, minmax(min(100%, 20rem), 1fr)); margin-bottom: 1rem; }
.q-multiples > div { break-inside: avoid; }
.q-legend { display: flex; flex-wrap: wrap; gap: .25rem 1.25rem; list-style: none; padding: 0; margin: .25rem 0 .5rem; font-size: .85rem; }
.q-legend svg { width: 1.1rem; height: 1.1rem; vertical-align: -.2rem; margin-right: .3rem; }
.q-note { color: var(--muted); font-size: .9rem; }
.q-warn { border-left: 4px solid var(--dup); background: #fff8ea; padding: .5rem .75rem; }
.q-warn::before { content: "⚠ "; }
.q-guard { font-style: italic; }
footer.q-foot { margin-top: 2.5rem; border-top: 1px solid var(--rule); padding-top: .75rem; font-size: .82rem; color: var(--muted); }
@media print {
  body { background: #fff; }
  main { max-width: none; padding: 0; }
  .q-table-box { max-height: none; overflow: visible; border: none; }
  table.q-table thead th { position: static; }
  .q-figure, .q-card, .q-multiples > div, table.q-table tr { break-inside: avoid; }
  h2 { break-after: avoid; }
  .q-figure { grid-template-columns: minmax(0, 1fr); }
}
`;
