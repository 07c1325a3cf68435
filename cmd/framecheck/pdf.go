package main

import (
	"bytes"
	"context"
	"errors"
	"fmt"
	"os"
	"os/exec"
	"path/filepath"
	"runtime"
	"time"
)

// pdfName is the file --pdf writes beside report.html.
const pdfName = "report.pdf"

// chromiumCandidates are where a Chromium-family browser is looked for,
// after $FRAMECHECK_CHROMIUM: the names on PATH, then the usual install
// places on macOS and Windows.
var chromiumCandidates = []string{
	"chromium", "chromium-browser", "google-chrome", "google-chrome-stable", "chrome", "msedge",
	"/usr/bin/chromium",
	"/Applications/Chromium.app/Contents/MacOS/Chromium",
	"/Applications/Google Chrome.app/Contents/MacOS/Google Chrome",
	`C:\Program Files\Google\Chrome\Application\chrome.exe`,
	`C:\Program Files (x86)\Microsoft\Edge\Application\msedge.exe`,
}

// findChromium returns the browser to print with, or "".
func findChromium() string {
	if p := os.Getenv("FRAMECHECK_CHROMIUM"); p != "" {
		return p
	}
	for _, c := range chromiumCandidates {
		if filepath.IsAbs(c) {
			if st, err := os.Stat(c); err == nil && !st.IsDir() {
				return c
			}
			continue
		}
		if p, err := exec.LookPath(c); err == nil {
			return p
		}
	}
	return ""
}

// errNoChromium says --pdf found no browser, and what to do.
var errNoChromium = errors.New("no Chromium or Chrome found to print report.pdf: install one (Debian: apt-get install chromium) " +
	"or set FRAMECHECK_CHROMIUM to its path, or open report.html in a browser and print it to PDF (Letter, no headers and footers)")

// writeReportPDF prints the report at htmlPath to report.pdf beside it with
// a headless Chromium (print CSS: Letter pages, the plan on a landscape
// page, page x of y, no browser header or footer), and returns its path.
// It waits at most two minutes.
func writeReportPDF(htmlPath string) (string, error) {
	browser := findChromium()
	if browser == "" {
		return "", errNoChromium
	}
	abs, err := filepath.Abs(htmlPath)
	if err != nil {
		return "", err
	}
	out := filepath.Join(filepath.Dir(abs), pdfName)
	tmp := out + ".part"
	profile, err := os.MkdirTemp("", "framecheck-chromium-")
	if err != nil {
		return "", err
	}
	defer os.RemoveAll(profile)
	url := "file://" + filepath.ToSlash(abs)
	if runtime.GOOS == "windows" {
		url = "file:///" + filepath.ToSlash(abs)
	}
	args := []string{"--headless", "--disable-gpu", "--no-first-run", "--disable-background-networking",
		"--disable-component-update", "--disable-sync", "--user-data-dir=" + profile,
		"--no-pdf-header-footer", "--print-to-pdf=" + tmp, url}
	if runtime.GOOS == "linux" && os.Geteuid() == 0 {
		args = append([]string{"--no-sandbox"}, args...) // Chromium refuses to run as root with its sandbox
	}
	ctx, cancel := context.WithTimeout(context.Background(), 2*time.Minute)
	defer cancel()
	var logb bytes.Buffer
	cmd := exec.CommandContext(ctx, browser, args...)
	cmd.Stdout, cmd.Stderr = &logb, &logb
	runErr := cmd.Run()
	data, err := os.ReadFile(tmp)
	if err != nil || !bytes.HasPrefix(data, []byte("%PDF")) {
		os.Remove(tmp)
		tail := logb.Bytes()
		if len(tail) > 400 {
			tail = tail[len(tail)-400:]
		}
		return "", fmt.Errorf("%s did not print %s (%v): %s", browser, out, runErr, bytes.TrimSpace(tail))
	}
	if err := os.Rename(tmp, out); err != nil {
		os.Remove(tmp)
		return "", err
	}
	return out, nil
}
