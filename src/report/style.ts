/** The report's stylesheet (our own look: slate ink, brick accent, plain sans-serif, print-friendly). */
export const REPORT_CSS = `
:root { --ink: #1f2a44; --accent: #c2412d; --muted: #5f6b7a; --rule: #d5dae1; --panel: #f6f7f9; }
* { box-sizing: border-box; }
body { margin: 0; font: 14px/1.45 Helvetica, Arial, sans-serif; color: #1d1d1f; background: #ffffff; }
header { background: var(--ink); color: #fff; padding: 18px 32px 14px; border-bottom: 4px solid var(--accent); }
header h1 { margin: 0 0 4px; font-size: 22px; font-weight: 600; }
header p { margin: 0; color: #cfd6e2; }
main { max-width: 1180px; margin: 0 auto; padding: 8px 32px 48px; }
section { margin-top: 28px; }
h2 { font-size: 18px; color: var(--ink); border-bottom: 1px solid var(--rule); padding-bottom: 4px; margin: 0 0 12px; }
h3 { font-size: 15px; margin: 18px 0 6px; color: var(--ink); }
p.note, figcaption { color: var(--muted); font-size: 13px; }
table { border-collapse: collapse; font-size: 13px; }
th, td { border-bottom: 1px solid var(--rule); padding: 4px 10px; text-align: left; vertical-align: top; }
th { background: var(--panel); font-weight: 600; }
td.num { text-align: right; font-variant-numeric: tabular-nums; }
table.summary th { width: 15em; background: none; color: var(--muted); font-weight: normal; }
.scroll { overflow-x: auto; }
details { margin: 8px 0; border: 1px solid var(--rule); border-radius: 4px; background: var(--panel); }
summary { cursor: pointer; padding: 6px 10px; font-weight: 600; }
details pre { margin: 0; padding: 10px 14px; max-height: 28em; overflow: auto; background: #fff; border-top: 1px solid var(--rule); font-size: 12px; }
.grid { display: grid; grid-template-columns: repeat(auto-fit, minmax(520px, 1fr)); gap: 18px; align-items: start; }
figure { margin: 0; padding: 10px; border: 1px solid var(--rule); border-radius: 4px; background: #fff; }
figure svg { max-width: 100%; height: auto; }
.chart { min-height: 120px; width: 100%; }
figure.dynamics { margin-bottom: 16px; }
.side { display: grid; grid-template-columns: minmax(0, 1fr) auto; gap: 18px; align-items: start; }
@media (max-width: 900px) { .side { grid-template-columns: 1fr; } }
table.ranking td { white-space: nowrap; }
#viewer { position: relative; width: 100%; height: 480px; border: 1px solid var(--rule); border-radius: 4px; }
.tag { display: inline-block; padding: 0 6px; border-radius: 3px; font-size: 12px; background: var(--panel); color: var(--muted); }
.tag.objective { background: #fbe9e5; color: var(--accent); }
.error { color: var(--accent); }
a.save, button { font-size: 12px; color: var(--ink); }
footer { max-width: 1180px; margin: 0 auto; padding: 16px 32px 32px; color: var(--muted); font-size: 12px; border-top: 1px solid var(--rule); }
@media print { header { background: none; color: #000; } #viewer { display: none; } details pre { max-height: none; } }
`;
