// The report's style sheet: plain, high contrast, print first; verdicts carry words and symbols too.
#include "sifter/report/html_style.hpp"

namespace sifter::report {

namespace {

constexpr const char* kHtmlStyle = R"css(
:root { --ink: #141414; --muted: #4d4d4d; --rule: #8c8c8c; --hair: #d4d4d4; --soft: #f4f4f1;
        --good: #17457a; --bad: #9c3300; --neutral: #555555; }
* { box-sizing: border-box; }
html { background: #ffffff; }
body { font-family: sans-serif; color: var(--ink); background: #ffffff; font-size: 10.5pt; line-height: 1.42;
       max-width: 200mm; margin: 0 auto; padding: 10mm 8mm 16mm; }
h1 { font-size: 19pt; line-height: 1.2; margin: 2mm 0 4mm; }
h2 { font-size: 14pt; margin: 0 0 2mm; padding-top: 2mm; border-top: 3px solid var(--ink); }
h3 { font-size: 11pt; margin: 6mm 0 1.5mm; }
p { margin: 1.5mm 0; }
.kind { font-size: 9pt; letter-spacing: 0.12em; text-transform: uppercase; color: var(--muted); margin: 0;
        border-top: 8px solid var(--ink); padding-top: 3mm; }
dl.meta { display: grid; grid-template-columns: 44mm 1fr; gap: 0.8mm 4mm; margin: 0 0 5mm; font-size: 9.5pt; }
dl.meta dt { color: var(--muted); }
dl.meta dd { margin: 0; overflow-wrap: anywhere; }
.mono { font-family: monospace; font-size: 9pt; }
.caution { border: 2px solid var(--ink); border-left-width: 7px; padding: 2.5mm 4mm; margin: 4mm 0 6mm;
           background: var(--soft); }
.caution strong { display: block; font-size: 10pt; letter-spacing: 0.06em; text-transform: uppercase; }
nav.contents ol { margin: 1mm 0 4mm; padding-left: 6mm; columns: 2; font-size: 9.5pt; }
nav.contents a { color: var(--ink); text-decoration: none; }
section { margin-top: 8mm; }
table { border-collapse: collapse; width: 100%; margin: 1.5mm 0 4mm; font-size: 9pt; }
caption { text-align: left; font-weight: 700; font-size: 9.5pt; padding-bottom: 1mm; }
th { text-align: left; vertical-align: bottom; border-bottom: 2px solid var(--ink); padding: 1mm 1.6mm;
     font-weight: 700; }
td { vertical-align: top; border-bottom: 1px solid var(--hair); padding: 0.9mm 1.6mm; }
th.num { text-align: right; }
#summary table { font-size: 8.5pt; }
#summary th, #summary td { padding-left: 1.2mm; padding-right: 1.2mm; }
#summary td { overflow-wrap: anywhere; }
#summary td.key { min-width: 7em; }
#summary td:nth-child(2) { min-width: 7em; }
#summary td:nth-child(10) { min-width: 10em; }
#summary td.key, #summary td.good, #summary td.bad, #summary td.neutral { white-space: normal; }
td.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
td.key, td.good, td.bad, td.neutral { white-space: nowrap; }
td.good, .verdict.good { color: var(--good); font-weight: 700; }
td.bad, .verdict.bad { color: var(--bad); font-weight: 700; }
td.neutral, .verdict.neutral { color: var(--neutral); font-style: italic; }
.verdict { font-size: 12pt; margin: 2mm 0; padding: 1.5mm 3mm; border: 1.5px solid currentColor; display: inline-block; }
.verdict.bad { border-width: 3px; border-style: double; }
.facts { color: var(--muted); font-size: 9.5pt; }
.absent { color: var(--muted); font-style: italic; border-left: 3px solid var(--hair); padding-left: 3mm; }
figure { margin: 3mm 0 5mm; break-inside: avoid; }
figcaption { font-size: 9pt; color: var(--muted); margin-top: 1mm; }
ul.findings li, ul.limits li { margin-bottom: 1mm; }
.tag { font-family: monospace; }
footer { margin-top: 10mm; border-top: 1px solid var(--rule); padding-top: 2mm; font-size: 9pt; color: var(--muted); }
svg.fig { display: block; max-width: 100%; height: auto; font-family: sans-serif; }
svg .frame, svg .ax { fill: none; stroke: var(--ink); stroke-width: 1; }
svg .grid { stroke: var(--hair); stroke-width: 0.7; }
svg .tick { font-size: 11px; fill: var(--muted); }
svg .axis-title { font-size: 12px; fill: var(--ink); }
svg .legend, svg .value, svg .note { font-size: 11px; fill: var(--ink); }
svg .label { font-size: 12px; font-weight: 700; fill: var(--ink); }
svg .role { font-size: 10px; letter-spacing: 0.1em; fill: var(--muted); }
svg .sif-line { fill: none; stroke: var(--ink); stroke-width: 2; }
svg .sub, svg .tail { fill: none; stroke-width: 1.3; }
svg .sub-0 { stroke: #17457a; stroke-dasharray: 7 3; }
svg .sub-1 { stroke: #7b2f86; stroke-dasharray: 2 2.5; }
svg .sub-2 { stroke: #2c6433; stroke-dasharray: 10 3 2 3; }
svg .sub-3 { stroke: #6b5200; stroke-dasharray: 1 4; stroke-width: 1.8; }
svg .tail-0 { stroke: var(--ink); stroke-width: 2.2; }
svg .tail-1 { stroke: var(--muted); stroke-width: 2.2; stroke-dasharray: 6 2; }
svg .total { stroke: var(--ink); stroke-width: 2.6; fill: none; }
svg .avg-line { stroke: var(--ink); stroke-width: 1.4; stroke-dasharray: 1.5 3; }
svg .req-line { stroke: var(--bad); stroke-width: 2; stroke-dasharray: 11 4; }
svg .limit-line { stroke: var(--good); stroke-width: 1.8; stroke-dasharray: 4 2; }
svg .now-line { stroke: var(--muted); stroke-width: 1; }
svg .band { fill: #17457a; fill-opacity: 0.13; stroke: none; }
svg .band-key { stroke: #17457a; stroke-opacity: 0.3; stroke-width: 9; }
svg .bar { fill: #4a6f96; stroke: var(--ink); stroke-width: 0.8; }
svg .dot { fill: var(--ink); }
svg .link { stroke: var(--muted); stroke-width: 0.9; stroke-dasharray: 1 3; }
svg .separator { stroke: var(--rule); stroke-width: 0.8; }
svg .group { fill: var(--soft); stroke: var(--ink); stroke-width: 1.4; }
svg .element { fill: #ffffff; stroke: var(--ink); stroke-width: 1; }
svg .badge { fill: var(--ink); }
svg .badge-text { fill: #ffffff; font-size: 11px; font-weight: 700; }
svg .tag { font-size: 11.5px; font-family: monospace; fill: var(--ink); }
svg .wire { stroke: var(--ink); stroke-width: 1.2; }
svg .arrow { fill: var(--ink); }
svg .mark-good { fill: var(--good); font-size: 14px; font-weight: 700; }
svg .mark-bad { fill: var(--bad); font-size: 14px; font-weight: 700; }
@page { size: A4; margin: 14mm 12mm 16mm; }
@media print {
  body { max-width: none; padding: 0; font-size: 9.5pt; }
  section.sif, section.scenario, section.closing { break-before: page; }
  table, figure, .caution { break-inside: avoid; }
  h2, h3, caption { break-after: avoid; }
  svg.fig { max-height: 76mm; width: auto; }
  #summary table { font-size: 7.5pt; }
  #summary th, #summary td { padding: 0.6mm 0.9mm; }
  nav.contents a { color: var(--ink); }
}
)css";

}  // namespace

const char* html_style() { return kHtmlStyle; }

}  // namespace sifter::report
