#!/usr/bin/env python3
"""Checks in a real browser that no text of the report's drawings leaves its SVG.

usage: svg_text_check.py CHROMIUM_COMMAND... -- REPORT.html WORKDIR

Copies the report with a small script added that measures every <text> of every inline <svg>
(getBBox, in the drawing's own units) against the drawing's viewBox, and writes the offenders
into the page; chromium --dump-dom prints the page after the script ran. The report itself
carries no script: only this test copy does.
"""
import pathlib
import re
import subprocess
import sys

MEASURE = r"""
<script>
(function () {
  var bad = [];
  var svgs = document.querySelectorAll('svg');
  for (var i = 0; i < svgs.length; i++) {
    var svg = svgs[i], vb = svg.viewBox.baseVal, box = svg.getBoundingClientRect();
    var sx = vb.width / box.width, sy = vb.height / box.height;
    var texts = svg.querySelectorAll('text');
    for (var j = 0; j < texts.length; j++) {
      // The box as drawn (rotation included), in the drawing's own units.
      var r = texts[j].getBoundingClientRect();
      var b = {x: vb.x + (r.left - box.left) * sx, y: vb.y + (r.top - box.top) * sy,
               width: r.width * sx, height: r.height * sy};
      // Half a pixel of slack for anti-aliasing.
      if (b.x < vb.x - 0.5 || b.y < vb.y - 0.5 || b.x + b.width > vb.x + vb.width + 0.5 ||
          b.y + b.height > vb.y + vb.height + 0.5)
        bad.push((svg.getAttribute('data-figure') || 'svg') + ': "' + texts[j].textContent + '" at x ' +
                 b.x.toFixed(1) + '..' + (b.x + b.width).toFixed(1) + ' of 0..' + vb.width);
    }
  }
  var out = document.createElement('pre');
  out.id = 'svg-text-check';
  out.textContent = 'checked ' + svgs.length + ' drawings\n' + bad.join('\n');
  document.body.appendChild(out);
})();
</script>
"""


def main():
    split = sys.argv.index("--")
    chromium, (report, work) = sys.argv[1:split], sys.argv[split + 1:]
    html = pathlib.Path(report).read_text(encoding="utf-8")
    probe = pathlib.Path(work) / "svg-probe.html"
    probe.write_text(html.replace("</body>", MEASURE + "</body>"), encoding="utf-8")
    dom = subprocess.run(chromium + ["--dump-dom", "file://" + str(probe.resolve())], capture_output=True, text=True,
                         timeout=120).stdout
    m = re.search(r'<pre id="svg-text-check">(.*?)</pre>', dom, re.S)
    if not m:
        sys.exit("svg text check FAILED: the probe did not run")
    lines = m.group(1).strip().split("\n")
    print(lines[0])
    if len(lines) > 1:
        print("\n".join(lines[1:]))
        sys.exit("svg text check FAILED: %d text boxes leave their drawing" % (len(lines) - 1))


if __name__ == "__main__":
    main()
