#!/usr/bin/env python3
"""Checks in a real browser that the report's tables fit their column, on screen and in print.

usage: table_width_check.py CHROMIUM_COMMAND... -- REPORT.html WORKDIR [SELECTOR]

Copies the report with a small script that measures each table matching SELECTOR (default: the
summary's tables, `#summary table`): its scrollWidth must not exceed the clientWidth of the
element that holds it. Screen: a window 1280 px wide, and a narrow one of 800 px. Print: the
copy's `@media print` rules are made to apply on screen and the window is as wide as the A4
page's text column (210 mm less the 12 mm margins each side = 186 mm = 703 px at 96 px per inch),
which is how chromium lays the page out when it prints. The report itself carries no script.
"""
import pathlib
import re
import subprocess
import sys

PROBE = r"""
<script>
(function () {
  var out = [], tables = document.querySelectorAll(%s);
  for (var i = 0; i < tables.length; i++) {
    var t = tables[i], holder = t.parentElement;
    var caption = t.caption ? t.caption.textContent : 'table ' + i;
    out.push((t.scrollWidth <= holder.clientWidth ? 'fits ' : 'WIDER ') + t.scrollWidth + ' ' +
             holder.clientWidth + ' ' + caption);
  }
  var pre = document.createElement('pre');
  pre.id = 'table-width-check';
  pre.textContent = out.join('\n');
  document.body.appendChild(pre);
})();
</script>
"""

A4_TEXT_WIDTH_PX = 703  # 186 mm at 96 px per inch


def measure(chromium, html, probe, width, selector):
    probe.write_text(html.replace("</body>", PROBE % repr(selector) + "</body>"), encoding="utf-8")
    dom = subprocess.run(chromium + ["--window-size=%d,2000" % width, "--dump-dom", "file://" + str(probe.resolve())],
                         capture_output=True, text=True, timeout=120).stdout
    m = re.search(r'<pre id="table-width-check">(.*?)</pre>', dom, re.S)
    if not m:
        sys.exit("table width check FAILED: the probe did not run")
    return [line for line in m.group(1).strip().split("\n") if line]


def main():
    split = sys.argv.index("--")
    chromium, rest = sys.argv[1:split], sys.argv[split + 1:]
    report, work = rest[0], rest[1]
    selector = rest[2] if len(rest) > 2 else "#summary table"
    html = pathlib.Path(report).read_text(encoding="utf-8")
    probe = pathlib.Path(work) / "table-probe.html"
    printed = re.sub(r"@media print", "@media all", html)
    bad = []
    for name, text, width in (("screen 1280 px", html, 1280), ("screen 800 px", html, 800),
                              ("print, A4 column %d px" % A4_TEXT_WIDTH_PX, printed, A4_TEXT_WIDTH_PX)):
        lines = measure(chromium, text, probe, width, selector)
        if not lines:
            sys.exit("table width check FAILED: no table matches %s" % selector)
        print("%s: %d tables measured (scrollWidth, holder's clientWidth)" % (name, len(lines)))
        bad += ["%s: %s" % (name, line) for line in lines if line.startswith("WIDER")]
    if bad:
        print("\n".join(bad))
        sys.exit("table width check FAILED: %d tables wider than their column" % len(bad))


if __name__ == "__main__":
    main()
