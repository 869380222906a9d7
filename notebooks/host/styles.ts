// The one stylesheet of the page and of `alight report` (inlined in both), so they look alike.
// Our own look: warm paper, a setup rail on the left, figures on plates with a coloured spine.
import { FOCUS } from '../figures/palette.js';

export const PAGE_CSS = `
:root {
  --paper: #f3efe6; --plate: #fffdf8; --ink: #1f2a33; --muted: #5d6771; --rule: #d8d1c1;
  --accent: #0b5c73; --accent-soft: #d7e9ee; --warn: #8a3b12; --warn-soft: #f8e6d8;
  --prose: "Iowan Old Style", "Palatino Linotype", Georgia, serif;
  --ui: system-ui, -apple-system, "Segoe UI", Roboto, sans-serif;
}
* { box-sizing: border-box; }
html, body { margin: 0; background: var(--paper); color: var(--ink); font: 14px/1.45 var(--ui); }
a { color: var(--accent); }
:focus-visible { outline: 3px solid ${FOCUS}; outline-offset: 2px; }
.masthead { display: flex; align-items: center; gap: 18px; padding: 10px 22px; border-bottom: 2px solid var(--ink); background: var(--plate); }
.wordmark { font: 700 20px/1 var(--prose); letter-spacing: 0.02em; }
.wordmark small { font: 400 12px var(--ui); color: var(--muted); margin-left: 6px; letter-spacing: 0; }
.studies { display: flex; flex-wrap: wrap; gap: 4px; margin: 0; padding: 0; list-style: none; }
.studies a { display: block; padding: 5px 10px; border-radius: 14px; text-decoration: none; color: var(--ink); border: 1px solid transparent; }
.studies a:hover { border-color: var(--rule); }
.studies a[aria-current="page"] { background: var(--ink); color: var(--plate); }
.layout { display: grid; grid-template-columns: 286px minmax(0, 1fr); gap: 20px; padding: 16px 22px 40px; }
.setup { position: sticky; top: 10px; align-self: start; max-height: calc(100vh - 20px); overflow: auto; background: var(--plate); border: 1px solid var(--rule); border-radius: 6px; padding: 12px 14px; }
.setup h2 { font: 600 11px var(--ui); text-transform: uppercase; letter-spacing: 0.08em; color: var(--muted); margin: 14px 0 6px; }
.setup h2:first-child { margin-top: 0; }
.control { display: grid; grid-template-columns: 1fr auto; gap: 2px 8px; margin: 0 0 9px; }
.control label { font-weight: 600; font-size: 13px; }
.control output { font-variant-numeric: tabular-nums; color: var(--accent); font-size: 13px; }
.control input[type=range], .control select, .control input[type=number] { grid-column: 1 / -1; width: 100%; }
.control select, .control input[type=number] { font: inherit; padding: 3px 4px; border: 1px solid var(--rule); border-radius: 4px; background: #fff; }
.scenario-name { font-weight: 600; }
.progress { height: 8px; background: var(--accent-soft); border-radius: 4px; overflow: hidden; margin: 6px 0; }
.progress > div { height: 100%; width: 0; background: var(--accent); transition: width 120ms linear; }
.run-line { display: flex; justify-content: space-between; align-items: center; gap: 8px; font-size: 12px; color: var(--muted); }
button, .button { font: 600 12px var(--ui); padding: 5px 10px; border-radius: 4px; border: 1px solid var(--ink); background: var(--plate); color: var(--ink); cursor: pointer; }
button:hover { background: var(--accent-soft); }
button:disabled { opacity: 0.45; cursor: default; }
.share { display: flex; flex-wrap: wrap; gap: 6px; }
.hint { font-size: 12px; color: var(--muted); margin: 6px 0 0; }
.hint code { font-size: 11px; background: var(--paper); padding: 1px 3px; border-radius: 3px; }
.caution { border-left: 4px solid var(--warn); background: var(--warn-soft); color: var(--warn); padding: 7px 10px; font-size: 12px; border-radius: 0 4px 4px 0; margin-top: 12px; }
.message { border-left: 4px solid var(--warn); background: var(--warn-soft); padding: 8px 12px; margin: 0 0 12px; white-space: pre-wrap; font-size: 13px; }
.study h1 { font: 600 26px/1.2 var(--prose); margin: 0 0 6px; }
.lede { font: 16px/1.5 var(--prose); max-width: 70ch; margin: 0 0 14px; }
.prose { font: 15px/1.55 var(--prose); max-width: 74ch; margin: 10px 0 14px; }
.plates { display: grid; grid-template-columns: repeat(auto-fill, minmax(440px, 1fr)); gap: 14px; margin: 6px 0 14px; }
.plate { margin: 0; background: var(--plate); border: 1px solid var(--rule); border-left: 4px solid var(--accent); border-radius: 4px; padding: 10px 12px 8px; min-width: 0; }
.plate.wide { grid-column: 1 / -1; }
.plate[data-final="false"] { border-left-color: #A86F00; }
.plate header h3 { font: 600 14px var(--ui); margin: 0; }
.plate header p { margin: 2px 0 6px; font-size: 12px; color: var(--muted); }
.plate-body svg { width: 100%; height: auto; display: block; }
.plate-body table { border-collapse: collapse; width: 100%; font-size: 12px; font-variant-numeric: tabular-nums; }
.plate-body th, .plate-body td { text-align: right; padding: 3px 6px; border-bottom: 1px solid var(--rule); }
.plate-body th:first-child, .plate-body td:first-child { text-align: left; }
.numbers { display: flex; flex-wrap: wrap; gap: 4px 18px; margin: 6px 0 0; }
.numbers div { display: flex; flex-direction: column; }
.numbers dt { font-size: 11px; color: var(--muted); }
.numbers dd { margin: 0; font: 600 16px var(--ui); font-variant-numeric: tabular-nums; }
.numbers dd[data-key*="Verdict"], .numbers dd[data-key="worst"] { font-size: 13px; max-width: 60ch; }
.plate-foot { display: flex; justify-content: space-between; align-items: center; gap: 6px; margin-top: 6px; font-size: 11px; color: var(--muted); }
.plate-foot .exports { display: flex; gap: 4px; }
.plate-foot button { font-size: 11px; padding: 2px 7px; }
.dropzone { border: 2px dashed var(--accent); border-radius: 6px; padding: 16px; text-align: center; background: var(--plate); margin: 8px 0 14px; }
.dropzone.over { background: var(--accent-soft); }
.report-meta { font-size: 13px; border-collapse: collapse; margin: 6px 0 12px; }
.report-meta td { padding: 2px 10px 2px 0; }
.report-main { max-width: 1100px; margin: 0 auto; padding: 18px 22px 40px; }
.field-problem { grid-column: 1 / -1; margin: 2px 0 0; color: var(--warn); font-size: 12px; }
.control input[aria-invalid="true"] { border-color: var(--warn); outline: 2px solid var(--warn); }
.plate-body caption { caption-side: top; text-align: left; font-size: 11px; color: var(--muted); padding: 0 0 3px; }
.plate-body th[scope="row"] { font-weight: 400; }
.verdict { font-weight: 600; }
.verdict.bad { color: var(--warn); }
.study-problems:empty { display: none; }
#open-scenario { margin: 0 0 6px; }
.focus-tip { position: absolute; z-index: 10; max-width: 320px; background: var(--ink); color: var(--plate); font-size: 12px; padding: 4px 8px; border-radius: 4px; pointer-events: none; }
svg [data-tip]:focus { outline: none; stroke: ${FOCUS}; stroke-width: 3px; }
.compare-controls { margin-top: 6px; }
.comparison { background: var(--plate); border: 1px solid var(--rule); border-left: 4px solid var(--ink); border-radius: 4px; padding: 8px 12px; margin: 0 0 14px; }
.comparison h2 { font: 600 15px var(--ui); margin: 0 0 4px; }
.comparison table { border-collapse: collapse; width: 100%; font-size: 12px; font-variant-numeric: tabular-nums; margin: 6px 0; }
.comparison caption { caption-side: top; text-align: left; font-size: 11px; color: var(--muted); padding: 0 0 3px; }
.comparison th, .comparison td { text-align: right; padding: 3px 6px; border-bottom: 1px solid var(--rule); }
.comparison th[scope="row"], .comparison th:first-child { text-align: left; font-weight: 400; }
.scenario-form { margin: 0 0 8px; font-size: 12px; }
.scenario-form > summary, .scenario-section > summary { cursor: pointer; font-weight: 600; padding: 2px 0; }
.scenario-section { margin-left: 8px; }
.scenario-field label { font-weight: 400; font-size: 12px; }
.scenario-field input { font: inherit; padding: 2px 4px; border: 1px solid var(--rule); border-radius: 4px; grid-column: 1 / -1; }
details pre { font-size: 11px; background: var(--plate); border: 1px solid var(--rule); padding: 8px; overflow: auto; max-height: 320px; }
`;
