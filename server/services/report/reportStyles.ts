/** The report's only style sheet, written into the page so it needs no other file. */
export const REPORT_CSS = `
body { font-family: "DejaVu Sans", system-ui, sans-serif; color: #1d232b; margin: 2rem auto; max-width: 1100px; padding: 0 1rem; line-height: 1.45; }
h1 { font-size: 1.7rem; margin-bottom: 0.2rem; }
h2 { border-bottom: 2px solid #1b5e9e; padding-bottom: 0.2rem; margin-top: 2.5rem; }
h3 { margin-top: 1.8rem; }
table { border-collapse: collapse; margin: 0.6rem 0 1rem; font-size: 0.85rem; }
th, td { border: 1px solid #d9dcd6; padding: 0.2rem 0.45rem; text-align: left; vertical-align: top; overflow-wrap: anywhere; }
th { background: #eef3f8; }
td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; }
.caveat { border-left: 4px solid #e3860b; background: #fdf5ea; padding: 0.6rem 1rem; margin: 1rem 0; }
.note { color: #444; font-style: italic; }
.warnings li { color: #7a4a00; }
details.settings { margin: 0.4rem 0; font-size: 0.85rem; }
details.settings pre { background: #f5f6f4; padding: 0.5rem; overflow-x: auto; max-height: 24rem; }
.figures { display: flex; flex-wrap: wrap; gap: 1rem; }
figure { margin: 0.5rem 0; width: calc(50% - 0.5rem); min-width: 320px; max-width: 650px; }
figure img { max-width: 100%; height: auto; border: 1px solid #d9dcd6; }
figcaption { font-size: 0.85rem; }
figcaption .files { color: #666; display: block; }
nav ul { columns: 2; }
@media print { .figures { display: block; } figure { page-break-inside: avoid; } details.settings pre { max-height: none; } }
`;
