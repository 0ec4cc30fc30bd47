#!/usr/bin/env bash
# Runs every test. Installs the PDF checkers the tests call (poppler-utils: pdfinfo, pdffonts; qpdf) when they
# are missing and apt-get is available; everything else comes with the .NET 10 SDK and NuGet restore.
set -euo pipefail
cd "$(dirname "$0")"
if ! command -v pdfinfo >/dev/null || ! command -v pdffonts >/dev/null || ! command -v qpdf >/dev/null; then
  if command -v apt-get >/dev/null; then
    SUDO=""; [ "$(id -u)" = 0 ] || SUDO="sudo"
    ($SUDO apt-get update -qq && $SUDO apt-get install -y -qq poppler-utils qpdf) >/dev/null 2>&1 \
      || echo "warning: could not install poppler-utils and qpdf; the PDF checks will fail" >&2
  else
    echo "warning: install poppler-utils and qpdf for the PDF checks" >&2
  fi
fi
dotnet test ReportBuilder.sln "$@"
