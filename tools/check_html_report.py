#!/usr/bin/env python3
"""Open ringheat's HTML hazard report in headless Chromium and check that the chart and the
cautions render.

Two looks, both from Chromium itself (Debian's `chromium` package):
  1. `--dump-dom`: the DOM after parsing and layout must hold the inline SVG chart
     (`svg#ringheat-chart`) with one rise bar per screened step, the three severity bands, the
     500 J/g line, and both caution blocks with every caution sentence;
  2. `--screenshot`: the painted page, decoded here (standard-library PNG reader), must show the
     colours of the chart: the bars and the three severity bands, in more than a few pixels each.
The screenshot is kept (default target/hazard-report/screenshot.png) so a person can look at it.

Usage: python3 tools/check_html_report.py REPORT.html [SCREENSHOT.png]
Exit status 0 when every check holds; the failures are printed otherwise. Standard library only.
"""

import os
import re
import shutil
import struct
import subprocess
import sys
import tempfile
import zlib

FLAGS = [
    "--headless",
    "--no-sandbox",
    "--disable-gpu",
    "--disable-quic",
    "--no-first-run",
    "--disable-background-networking",
    "--disable-component-update",
    "--disable-sync",
]
# Colours written by src/report/html.rs (BAND_COLOURS, RISE_COLOUR, HEAT_COLOUR).
COLOURS = {
    "low band": (0xD8, 0xF0, 0xD2),
    "medium band": (0xFB, 0xE7, 0xB5),
    "high band": (0xF6, 0xC3, 0xBD),
    "rise bars": (0x7A, 0x3B, 0x8F),
    "heat bars": (0x3B, 0x6E, 0xA8),
}
CAUTION_WORDS = [
    "Screening estimates only",
    "Confirm with calorimetry (DSC, ARC or reaction calorimetry) and a qualified process-safety review",
    "Follow local codes and licensed practice",
]


def chromium():
    for name in ("chromium", "chromium-browser", "google-chrome"):
        path = shutil.which(name)
        if path:
            return path
    raise SystemExit("no chromium on PATH (Debian: apt-get install chromium)")


def run(args, profile):
    cmd = [chromium(), *FLAGS, f"--user-data-dir={profile}", *args]
    done = subprocess.run(cmd, capture_output=True, text=True, timeout=180)
    if done.returncode != 0:
        raise SystemExit(f"chromium failed ({done.returncode}): {done.stderr[-2000:]}")
    return done.stdout


def read_png(path):
    """(width, height, rows of RGB tuples) of an 8-bit RGB or RGBA PNG."""
    with open(path, "rb") as f:
        data = f.read()
    if data[:8] != b"\x89PNG\r\n\x1a\n":
        raise ValueError("not a PNG")
    pos, chunks, header = 8, [], None
    while pos < len(data):
        (length,) = struct.unpack(">I", data[pos : pos + 4])
        kind = data[pos + 4 : pos + 8]
        body = data[pos + 8 : pos + 8 + length]
        if kind == b"IHDR":
            header = struct.unpack(">IIBBBBB", body)
        elif kind == b"IDAT":
            chunks.append(body)
        pos += 12 + length
    width, height, depth, colour, _, _, interlace = header
    if depth != 8 or colour not in (2, 6) or interlace != 0:
        raise ValueError(f"unsupported PNG (depth {depth}, colour type {colour})")
    bpp = 3 if colour == 2 else 4
    raw = zlib.decompress(b"".join(chunks))
    stride = width * bpp
    prev = bytearray(stride)
    rows = []
    i = 0
    for _ in range(height):
        kind = raw[i]
        line = bytearray(raw[i + 1 : i + 1 + stride])
        i += 1 + stride
        for x in range(stride):
            a = line[x - bpp] if x >= bpp else 0
            b = prev[x]
            c = prev[x - bpp] if x >= bpp else 0
            if kind == 1:
                line[x] = (line[x] + a) & 0xFF
            elif kind == 2:
                line[x] = (line[x] + b) & 0xFF
            elif kind == 3:
                line[x] = (line[x] + (a + b) // 2) & 0xFF
            elif kind == 4:
                p = a + b - c
                pa, pb, pc = abs(p - a), abs(p - b), abs(p - c)
                pred = a if pa <= pb and pa <= pc else (b if pb <= pc else c)
                line[x] = (line[x] + pred) & 0xFF
        rows.append(line)
        prev = line
    return width, height, rows, bpp


def count_colours(path):
    width, height, rows, bpp = read_png(path)
    counts = {name: 0 for name in COLOURS}
    # The chart sits near the top of the page; the first 900 rows hold it.
    for line in rows[:900]:
        for x in range(0, width * bpp, bpp):
            px = (line[x], line[x + 1], line[x + 2])
            for name, rgb in COLOURS.items():
                if all(abs(px[k] - rgb[k]) <= 3 for k in range(3)):
                    counts[name] += 1
    return counts


def main(argv):
    if len(argv) < 2:
        raise SystemExit(__doc__)
    report = os.path.abspath(argv[1])
    shot = os.path.abspath(argv[2]) if len(argv) > 2 else os.path.join(
        os.path.dirname(report), "screenshot.png"
    )
    url = "file://" + report
    problems = []
    with tempfile.TemporaryDirectory(prefix="ringheat-chromium-") as profile:
        dom = run(["--dump-dom", url], profile)
    with tempfile.TemporaryDirectory(prefix="ringheat-chromium-") as profile:
        run(["--window-size=1300,2400", f"--screenshot={shot}", "--hide-scrollbars", url], profile)
    if '<svg id="ringheat-chart"' not in dom:
        problems.append("the DOM has no svg#ringheat-chart")
    bars = len(re.findall(r'class="bar-rise"', dom))
    steps = len(re.findall(r"<tr><td>", dom.split("<h2>Compounds</h2>")[0]))
    if bars == 0:
        problems.append("no rise bars in the chart")
    for band in ("low", "medium", "high"):
        if f'class="band band-{band}"' not in dom:
            problems.append(f"no {band} severity band in the chart")
    if 'id="screening-line"' not in dom:
        problems.append("no 500 J/g line in the chart")
    for block in ('id="cautions-top"', 'id="cautions"'):
        if block not in dom:
            problems.append(f"no caution block {block}")
    for words in CAUTION_WORDS:
        if dom.count(words) < 2:
            problems.append(f"caution not printed twice: {words!r}")
    counts = count_colours(shot)
    for name, n in counts.items():
        if n < 200:
            problems.append(f"screenshot shows too little of the {name} ({n} pixels)")
    print(f"report: {report}")
    print(f"screenshot: {shot}")
    print(f"DOM: {bars} rise bars, {steps} step rows; pixels: " + ", ".join(f"{k} {v}" for k, v in counts.items()))
    if problems:
        for p in problems:
            print(f"FAIL: {p}")
        return 1
    print("chart and cautions render in headless Chromium")
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv))
