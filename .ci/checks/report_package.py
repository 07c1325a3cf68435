"""Reads the printed calculation package back (poppler's pdfinfo and
pdftotext) and checks it against the report's own headings.

    report_package.py REPORT.html REPORT.pdf
"""
import html
import re
import subprocess
import sys

MAX_PAGES = 19  # issue 16: under 20 Letter pages for the demo


def fail(msg):
    print("report_package: " + msg, file=sys.stderr)
    sys.exit(1)


def run(*args):
    return subprocess.run(args, check=True, capture_output=True, text=True).stdout


def norm(s):
    return " ".join(s.split())


def main(html_path, pdf_path):
    info = run("pdfinfo", pdf_path)
    pages = int(re.search(r"^Pages:\s+(\d+)", info, re.M).group(1))
    if pages > MAX_PAGES:
        fail("%d pages, want at most %d" % (pages, MAX_PAGES))
    headings = set()
    src = open(html_path, encoding="utf-8").read()
    for m in re.finditer(r"<h([234])[^>]*>(.*?)</h\1>", src, re.S):
        text = norm(html.unescape(re.sub(r"<[^>]+>", " ", m.group(2))))
        if text:
            headings.add(text)
    plan_page = None
    for p in range(1, pages + 1):
        text = run("pdftotext", "-f", str(p), "-l", str(p), "-layout", pdf_path, "-")
        lines = [norm(l) for l in text.splitlines() if l.strip()]
        if not lines:
            fail("page %d is empty" % p)
        foot = "Page %d of %d" % (p, pages)
        if not any(foot in l for l in lines[-2:]):
            fail("page %d: no %r at its foot (last lines %r)" % (p, foot, lines[-2:]))
        if "file://" in text or "http" in text:
            fail("page %d shows an address" % p)
        body = [l for l in lines if foot not in l]
        if body and body[-1] in headings:
            fail("page %d ends on the heading %r" % (p, body[-1]))
        if any(l.startswith("Plan: members coloured") for l in lines[:2]):
            plan_page = p
    if plan_page is None:
        fail("no page starts with the plan")
    size = run("pdfinfo", "-f", str(plan_page), "-l", str(plan_page), pdf_path)
    w, h = map(float, re.search(r"Page\s+%d size:\s+([\d.]+) x ([\d.]+)" % plan_page, size).groups())
    if not w > h:
        fail("plan page %d is %g x %g pt, want landscape" % (plan_page, w, h))
    first = run("pdfinfo", "-f", "1", "-l", "1", pdf_path)
    w1, h1 = map(float, re.search(r"Page\s+1 size:\s+([\d.]+) x ([\d.]+)", first).groups())
    if not h1 > w1:
        fail("page 1 is %g x %g pt, want portrait Letter" % (w1, h1))
    print("report_package: %d pages (at most %d), plan on page %d landscape %gx%g pt, %d headings never last on a page"
          % (pages, MAX_PAGES, plan_page, w, h, len(headings)))


if __name__ == "__main__":
    main(sys.argv[1], sys.argv[2])
