// The shot sheet's stylesheet: readable on screen, one or two A4/Letter pages in print.
export const SHEET_CSS = `
:root { --ink: #1e2130; --muted: #5b6072; --rule: #d5d8e2; --accent: #4b3fb8; --warm: #b5611a; --alert: #9c2f2f; --paper: #fbfbfd; }
* { box-sizing: border-box; }
body { margin: 0; background: var(--paper); color: var(--ink); font: 14px/1.45 'Fira Sans', system-ui, sans-serif; }
main { max-width: 900px; margin: 0 auto; padding: 28px 32px 40px; }
header { border-bottom: 3px solid var(--accent); padding-bottom: 10px; margin-bottom: 18px; }
h1 { font-size: 26px; margin: 0 0 4px; letter-spacing: -0.01em; }
h2 { font-size: 15px; text-transform: uppercase; letter-spacing: 0.06em; color: var(--accent); margin: 22px 0 8px; }
.meta { color: var(--muted); margin: 0; }
.grid { display: grid; grid-template-columns: 1fr 1fr; gap: 0 28px; }
dl { display: grid; grid-template-columns: max-content 1fr; gap: 3px 14px; margin: 0; }
dt { color: var(--muted); }
dd { margin: 0; font-variant-numeric: tabular-nums; }
table { width: 100%; border-collapse: collapse; font-variant-numeric: tabular-nums; }
th, td { text-align: left; padding: 5px 8px; border-bottom: 1px solid var(--rule); vertical-align: top; }
th { font-weight: 600; color: var(--muted); font-size: 12px; }
.gel { color: var(--warm); font-weight: 600; }
.no { color: var(--alert); }
.diagram { width: 100%; height: auto; max-width: 520px; display: block; margin: 4px auto; }
.diagram text { font: 11px 'Fira Sans', system-ui, sans-serif; fill: var(--ink); }
.diagram .axis { stroke: var(--rule); stroke-dasharray: 4 4; }
.diagram .throw { stroke: var(--accent); stroke-width: 1.5; }
.diagram .key { fill: var(--accent); }
.diagram .rim { fill: var(--warm); }
.diagram .beam { fill: var(--warm); fill-opacity: 0.12; stroke: var(--warm); stroke-opacity: 0.5; }
.diagram .subject { fill: var(--ink); }
.diagram .camera { fill: #fff; stroke: var(--ink); stroke-width: 1.5; }
.diagram .bg { stroke: var(--muted); stroke-dasharray: 2 5; }
.diagram .scale { stroke: var(--ink); stroke-width: 2; }
.cautions { border: 2px solid var(--alert); border-radius: 6px; padding: 4px 16px 12px; }
.cautions h2 { color: var(--alert); }
.cautions li { margin-bottom: 6px; }
.also li { margin-bottom: 3px; }
.notes { white-space: pre-wrap; }
footer { margin-top: 26px; color: var(--muted); font-size: 12px; border-top: 1px solid var(--rule); padding-top: 8px; }
.print-hint { color: var(--muted); font-size: 12px; }
.lowered { color: var(--warm); font-size: 12px; }
.table-scroll { overflow-x: auto; }
@media (max-width: 640px) {
  .grid { grid-template-columns: 1fr; }
  main { padding: 16px; }
  th, td { padding: 4px 5px; }
  /* Seven columns do not fit a phone: each suggested minute becomes a card of labelled lines. */
  .minutes thead { display: none; }
  .minutes tr { display: block; padding: 6px 0; border-bottom: 1px solid var(--rule); }
  .minutes td { display: flex; gap: 12px; border: 0; padding: 2px 0; }
  .minutes td::before { content: attr(data-label); color: var(--muted); min-width: 10.5em; }
  .minutes td:first-child { font-weight: 600; }
}
@media print {
  @page { margin: 14mm; }
  body { background: #fff; font-size: 11pt; }
  main { max-width: none; padding: 0; }
  .print-hint { display: none; }
  section, table, .diagram { break-inside: avoid; }
  /* The safety list is longer than what is left of most pages: let it flow, keep items whole. */
  section.cautions { break-inside: auto; }
  .cautions li { break-inside: avoid; }
  h2 { break-after: avoid; }
}
`;
