#!/usr/bin/env python3
"""Reads a PNG with the standard library only and checks that a screenshot shows a page.

usage: png_check.py FILE.png WIDTH MIN_HEIGHT MAX_HEIGHT
       png_check.py --crop FILE.png X Y W H OUT.png   (for looking at a part of a screenshot)

A page is "shown" when the image has the expected size, is not one colour, has ink (pixels
that differ from the background) in each third of its height, and ink covers neither almost
nothing nor almost everything.
"""
import struct
import sys
import zlib

# Shares of the image that must differ from the background (first pixel): a rendered report
# has text and figures all the way down, but is mostly white paper.
MIN_INK_SHARE = 0.005
MAX_INK_SHARE = 0.60


def read_png(path):
    """Returns (width, height, channels, rows) with rows as bytes, unfiltered (PNG spec 9.2)."""
    data = open(path, "rb").read()
    if data[:8] != b"\x89PNG\r\n\x1a\n":
        raise ValueError("not a PNG file")
    pos, idat, header = 8, [], None
    while pos < len(data):
        (length,) = struct.unpack(">I", data[pos:pos + 4])
        kind, body = data[pos + 4:pos + 8], data[pos + 8:pos + 8 + length]
        if kind == b"IHDR":
            header = struct.unpack(">IIBBBBB", body)
        elif kind == b"IDAT":
            idat.append(body)
        pos += 12 + length
    width, height, depth, colour, _, _, interlace = header
    channels = {0: 1, 2: 3, 4: 2, 6: 4}.get(colour)
    if depth != 8 or channels is None or interlace != 0:
        raise ValueError("only 8-bit, non-interlaced grey or RGB(A) PNG is read here")
    raw = zlib.decompress(b"".join(idat))
    stride = width * channels
    rows, prev = [], bytes(stride)
    for y in range(height):
        start = y * (stride + 1)
        kind, line = raw[start], bytearray(raw[start + 1:start + 1 + stride])
        unfilter(kind, line, prev, channels)
        prev = bytes(line)
        rows.append(prev)
    return width, height, channels, rows


def unfilter(kind, line, prev, bpp):
    n = len(line)
    if kind == 0:
        return
    if kind == 1:
        for i in range(bpp, n):
            line[i] = (line[i] + line[i - bpp]) & 255
    elif kind == 2:
        if any(line):
            line[:] = bytes((a + b) & 255 for a, b in zip(line, prev))
        else:
            line[:] = prev
    elif kind == 3:
        for i in range(n):
            left = line[i - bpp] if i >= bpp else 0
            line[i] = (line[i] + ((left + prev[i]) >> 1)) & 255
    elif kind == 4:
        for i in range(n):
            a = line[i - bpp] if i >= bpp else 0
            b = prev[i]
            c = prev[i - bpp] if i >= bpp else 0
            p = a + b - c
            pa, pb, pc = abs(p - a), abs(p - b), abs(p - c)
            pred = a if pa <= pb and pa <= pc else (b if pb <= pc else c)
            line[i] = (line[i] + pred) & 255
    else:
        raise ValueError("unknown PNG filter %d" % kind)


def ink_per_row(width, channels, rows):
    background = rows[0][:channels]
    blank = background * width
    return [0 if r == blank else sum(1 for x in range(0, len(r), channels) if r[x:x + channels] != background)
            for r in rows]


def check(path, want_width, min_height, max_height):
    width, height, channels, rows = read_png(path)
    problems = []
    if width != want_width:
        problems.append("width %d, expected %d" % (width, want_width))
    if not min_height <= height <= max_height:
        problems.append("height %d, expected %d to %d" % (height, min_height, max_height))
    ink = ink_per_row(width, channels, rows)
    share = sum(ink) / float(width * height)
    if share < MIN_INK_SHARE:
        problems.append("blank: only %.4f of the pixels differ from the background" % share)
    if share > MAX_INK_SHARE:
        problems.append("%.2f of the pixels differ from the background: not a page on paper" % share)
    third = height // 3
    for k, name in enumerate(["top", "middle", "bottom"]):
        if sum(ink[k * third:(k + 1) * third]) == 0:
            problems.append("nothing drawn in the %s third" % name)
    print("%s: %dx%d, ink on %.1f%% of the pixels" % (path, width, height, 100 * share))
    return problems


def write_png(path, width, height, channels, rows):
    colour = {1: 0, 2: 4, 3: 2, 4: 6}[channels]
    raw = b"".join(b"\x00" + r for r in rows)

    def chunk(kind, body):
        return struct.pack(">I", len(body)) + kind + body + struct.pack(">I", zlib.crc32(kind + body) & 0xffffffff)

    with open(path, "wb") as out:
        out.write(b"\x89PNG\r\n\x1a\n" + chunk(b"IHDR", struct.pack(">IIBBBBB", width, height, 8, colour, 0, 0, 0)) +
                  chunk(b"IDAT", zlib.compress(raw, 9)) + chunk(b"IEND", b""))


def main(argv):
    if len(argv) == 8 and argv[1] == "--crop":
        width, height, channels, rows = read_png(argv[2])
        x, y, w, h = (int(v) for v in argv[3:7])
        part = [r[x * channels:(x + w) * channels] for r in rows[y:y + h]]
        write_png(argv[7], w, len(part), channels, part)
        return 0
    if len(argv) != 5:
        print(__doc__, file=sys.stderr)
        return 2
    problems = check(argv[1], int(argv[2]), int(argv[3]), int(argv[4]))
    for p in problems:
        print("png_check: " + p, file=sys.stderr)
    return 1 if problems else 0


if __name__ == "__main__":
    sys.exit(main(sys.argv))
