/**
 * The report's print style sheet: A4 with 15 mm margins, serif body for print, tables that do not
 * break inside a row, each figure kept whole, the figures starting on a new page. Colours are ink
 * on white (printPalette.ts), whatever the screen's theme.
 */
export const REPORT_CSS = `
@page { size: A4; margin: 15mm 14mm 16mm; }
html { background: #ffffff; color: #1a1a1a; }
body { font-family: 'DejaVu Serif', Georgia, serif; font-size: 10pt; line-height: 1.35; margin: 0; }
h1 { font-size: 17pt; margin: 0 0 4pt; }
h2 { font-size: 12.5pt; margin: 14pt 0 5pt; border-bottom: 0.6pt solid #6b6b6b; padding-bottom: 2pt; break-after: avoid; }
h2.new-page { break-before: page; }
table { border-collapse: collapse; width: 100%; margin: 4pt 0 8pt; font-size: 9pt; }
th, td { text-align: left; padding: 2pt 5pt 2pt 0; border-bottom: 0.4pt solid #d4d4d4; vertical-align: top; }
thead th { border-bottom: 0.8pt solid #1a1a1a; }
thead { display: table-header-group; }
tr { break-inside: avoid; }
td.number { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
.meta th { width: 34%; font-weight: normal; color: #4a4a4a; }
.warning { color: #8b1f1a; }
.caution { border: 0.6pt solid #6b6b6b; padding: 4pt 6pt; margin: 6pt 0; font-size: 9pt; }
figure { margin: 8pt 0 12pt; break-inside: avoid; }
figure svg { max-width: 100%; height: auto; }
figcaption { font-size: 9pt; color: #4a4a4a; margin-top: 2pt; }
ul { margin: 3pt 0 6pt 14pt; padding: 0; }
code { font-family: 'DejaVu Sans Mono', monospace; font-size: 8.5pt; }
@media screen { body { max-width: 190mm; margin: 10mm auto; } }
`;
