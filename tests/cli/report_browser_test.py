#!/usr/bin/env python3
"""Renders reports in headless Chromium: the demo report and a 60-mode species. Fails on any
console message (our pages log nothing, so any message is an error), checks that the
screenshots are not blank (pixel variance over every band of the page) and that the DOM after
the script ran has every species section and the sortable index.

Screenshots are kept in BUILD_DIR/screenshots/ for a person to look at.

Then, in a live page driven over Chromium's DevTools protocol (python3-websocket): no text
of any picture is clipped or overlaps another (boxes as rendered), and the index is sorted
the way a reader sorts it, a real mouse click at the centre of a column heading, the order
of the rows read back and compared with the order the numbers demand.

Usage: report_browser_test.py VIBTHERM_EXE PROJECT_ROOT BUILD_DIR
"""
import os
import re
import shutil
import subprocess
import sys
import tempfile
import time
import urllib.request

from PIL import Image, ImageStat

exe, root, build = sys.argv[1], sys.argv[2], sys.argv[3]
chromium = shutil.which("chromium") or "/usr/bin/chromium"
failures = []


def check(condition, message):
    if not condition:
        failures.append(message)


def browser(args, page, tmp):
    """Runs Chromium once with a fresh profile; returns (stdout, console lines)."""
    profile = tempfile.mkdtemp(dir=tmp, prefix="profile-")
    command = [chromium, "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
               "--disable-background-networking", "--disable-component-update", "--disable-sync",
               "--hide-scrollbars", f"--user-data-dir={profile}", "--enable-logging=stderr", "--v=0"]
    result = subprocess.run(command + args + ["file://" + page], capture_output=True, text=True, timeout=180)
    console = [line for line in result.stderr.splitlines() if ":CONSOLE" in line]
    return result.stdout, console


def render(name, page, height, species_names, tmp):
    shots = os.path.join(build, "screenshots")
    os.makedirs(shots, exist_ok=True)
    png = os.path.join(shots, f"{name}.png")
    if os.path.exists(png):
        os.remove(png)
    _, console = browser([f"--window-size=1000,{height}", f"--screenshot={png}"], page, tmp)
    check(not console, f"{name}: console messages: {console[:3]}")
    dom, console = browser(["--dump-dom"], page, tmp)
    check(not console, f"{name}: console messages while dumping the DOM: {console[:3]}")

    # Every species has its section, and the index script ran (it marks the table sortable).
    ids = re.findall(r'<section class="species" id="(species-\d+)">\s*<h2>([^<]*)</h2>', dom)
    check([n for _, n in ids] == species_names, f"{name}: sections {[n for _, n in ids]}, expected {species_names}")
    check(re.search(r'<table id="index" class="index sortable">', dom) is not None,
          f"{name}: the index script did not run")

    check(os.path.exists(png), f"{name}: no screenshot")
    if not os.path.exists(png):
        return
    image = Image.open(png).convert("L")
    width, full = image.size
    # Content height: the last band with anything drawn; every 600 px band above it has ink.
    bands = [(y, ImageStat.Stat(image.crop((0, y, width, min(full, y + 600)))).stddev[0])
             for y in range(0, full, 600)]
    inked = [y for y, sd in bands if sd > 4.0]
    check(inked, f"{name}: the page is blank")
    if inked:
        blank = [y for y, sd in bands if y <= inked[-1] and sd <= 4.0]
        check(not blank, f"{name}: blank bands at y = {blank}")
        check(inked[-1] + 600 < full, f"{name}: the page is taller than the {full} px screenshot")
        print(f"{name}: {png}, content to about {inked[-1] + 600} px, {len(inked)} inked bands")


def species_names(args):
    import json
    result = subprocess.run([exe, "table"] + args + ["--temps", "298.15", "--format", "json", "-q"],
                            capture_output=True, text=True, cwd=root)
    return [s["name"] for s in json.loads(result.stdout)["species"]]


class DevTools:
    """A live headless Chromium page driven over its DevTools protocol (python3-websocket)."""

    def __init__(self, page, tmp):
        import json
        import websocket

        self.json = json
        profile = tempfile.mkdtemp(dir=tmp, prefix="profile-")
        self.proc = subprocess.Popen([chromium, "--headless", "--no-sandbox", "--disable-gpu", "--no-first-run",
                                      "--remote-debugging-port=0", f"--user-data-dir={profile}",
                                      "--window-size=1200,900", "file://" + page],
                                     stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL)
        port_file = os.path.join(profile, "DevToolsActivePort")
        for _ in range(300):
            if os.path.exists(port_file) and open(port_file).read().strip():
                break
            time.sleep(0.1)
        port = open(port_file).read().split()[0]
        targets = json.load(urllib.request.urlopen(f"http://127.0.0.1:{port}/json"))
        self.ws = websocket.create_connection(
            next(t for t in targets if t["type"] == "page")["webSocketDebuggerUrl"], timeout=60)
        self.ids = iter(range(1, 100000))
        for _ in range(300):
            if self.evaluate("document.readyState === 'complete' && document.querySelector('#index.sortable') !== null"):
                break
            time.sleep(0.1)

    def call(self, method, **params):
        i = next(self.ids)
        self.ws.send(self.json.dumps({"id": i, "method": method, "params": params}))
        while True:
            reply = self.json.loads(self.ws.recv())
            if reply.get("id") == i:
                return reply.get("result", {})

    def evaluate(self, expression):
        return self.call("Runtime.evaluate", expression=expression, returnByValue=True)["result"].get("value")

    def close(self):
        self.ws.close()
        self.proc.kill()
        self.proc.wait()


def click_sort(tools):
    """Clicks the S° and then the species heading of the index with real mouse events;
    returns [(label, names after the click, expected order, names before)]."""
    rows_js = ("Array.from(document.querySelectorAll('#index tbody tr')).map(r => "
               "[r.cells[0].textContent, r.cells[3].textContent])")
    before = [n for n, _ in tools.evaluate(rows_js)]  # the default order: warnings and worst fits first
    results = []
    for label, column in (("S° heading", 3), ("species heading", 0)):
        box = tools.evaluate(f"(() => {{ const th = document.querySelector('#index thead th:nth-child({column + 1})');"
                             "th.scrollIntoView(); const r = th.getBoundingClientRect();"
                             "return [r.left + r.width / 2, r.top + r.height / 2]; })()")
        for kind in ("mousePressed", "mouseReleased"):
            tools.call("Input.dispatchMouseEvent", type=kind, x=box[0], y=box[1], button="left", clickCount=1)
        rows = tools.evaluate(rows_js)
        if column == 3:  # numbers: the first click sorts the largest first
            expected = [n for n, _ in sorted(rows, key=lambda r: -float(r[1]))]
        else:
            expected = sorted(n for n, _ in rows)
        results.append((label, [n for n, _ in rows], expected, before))
        before = [n for n, _ in rows]
    return results


# In the rendered page: every SVG text's box lies inside its picture (nothing clipped) and
# no two texts of one picture overlap by more than 1 px each way (labels never collide).
TEXT_LAYOUT_JS = """(() => {
  const problems = [];
  document.querySelectorAll('svg').forEach((svg, k) => {
    const frame = svg.getBoundingClientRect();
    const boxes = Array.from(svg.querySelectorAll('text')).filter(t => t.textContent.trim() !== '')
        .map(t => [t.textContent, t.getBoundingClientRect()]);
    boxes.forEach(([text, r]) => {
      if (r.left < frame.left - 0.5 || r.right > frame.right + 0.5 || r.top < frame.top - 0.5 ||
          r.bottom > frame.bottom + 0.5) problems.push(`svg ${k}: '${text}' is clipped`);
    });
    for (let i = 0; i < boxes.length; i++)
      for (let j = i + 1; j < boxes.length; j++) {
        const a = boxes[i][1], b = boxes[j][1];
        const dx = Math.min(a.right, b.right) - Math.max(a.left, b.left);
        const dy = Math.min(a.bottom, b.bottom) - Math.max(a.top, b.top);
        if (dx > 1 && dy > 1) problems.push(`svg ${k}: '${boxes[i][0]}' overlaps '${boxes[j][0]}'`);
      }
  });
  return [document.querySelectorAll('svg').length, problems];
})()"""


def browser_checks(name, page, tmp, sort=False):
    tools = DevTools(page, tmp)
    try:
        count, problems = tools.evaluate(TEXT_LAYOUT_JS)
        check(count > 0 and not problems, f"{name}: {count} pictures, text layout: {problems[:5]}")
        print(f"{name}: {count} pictures, no text clipped or overlapping" if not problems else
              f"{name}: {len(problems)} text layout problems")
        if sort:
            for label, got, expected, before in click_sort(tools):
                check(got == expected and len(got) > 1, f"click on the {label}: rows {got}, expected {expected}")
                check(before != expected, f"click on the {label}: the order before the click was already {before}")
                print(f"click on the {label}: {got}")
    finally:
        tools.close()


if not os.path.exists(chromium):
    print("FAIL: chromium is not installed (scripts/install-deps installs it)")
    sys.exit(1)

with tempfile.TemporaryDirectory() as tmp:
    demo = os.path.join(tmp, "demo.html")
    examples = os.path.join(root, "examples", "fuel-additive")
    r = subprocess.run([exe, "report", examples, "-o", demo, "-q"], capture_output=True, text=True, cwd=root)
    check(r.returncode == 0, f"demo report: exit {r.returncode}: {r.stderr}")
    size = os.path.getsize(demo) if os.path.exists(demo) else 0
    check(0 < size < 400_000, f"demo report is {size} bytes, expected under 400 kB")
    print(f"demo report: {size} bytes")
    render("demo-report", demo, 30000, species_names([examples]), tmp)
    browser_checks("demo-report", demo, tmp, sort=True)

    # A layout fixture, not a molecule: 22 atoms' worth (60 modes) of wavenumbers spread
    # geometrically from 40 to 3600 cm^-1 on a rigid rotor given by its moments.
    fixture = os.path.join(tmp, "layout-60.yaml")
    wavenumbers = ", ".join(f"{40 * 90 ** (i / 59):.1f}" for i in range(60))
    with open(fixture, "w", encoding="utf-8") as f:
        f.write("name: layout-60\nformula: {C: 7, H: 14, O: 1}\nmass: 114.1\n"
                "moments_of_inertia: [150.0, 600.0, 700.0]\nlinear: false\nsymmetry_number: 1\n"
                f"enthalpy_of_formation: -250.0\nfrequencies: [{wavenumbers}]\n")
    page = os.path.join(tmp, "layout-60.html")
    r = subprocess.run([exe, "report", fixture, "-o", page, "-q"], capture_output=True, text=True)
    check(r.returncode == 0, f"60-mode report: exit {r.returncode}: {r.stderr}")
    render("layout-60-report", page, 8000, ["layout-60"], tmp)
    browser_checks("layout-60-report", page, tmp)

for f in failures:
    print("FAIL:", f)
print(f"{'ok' if not failures else 'FAILED'}: browser checks")
sys.exit(1 if failures else 0)
