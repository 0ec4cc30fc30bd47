#!/usr/bin/env bash
# Runs every test. Installs what the tests call when it is missing and apt-get is available: the PDF checkers
# (poppler-utils: pdfinfo, pdffonts; qpdf), Debian's chromium for the web page's browser tests, and node/npm to fetch
# axe-core (the accessibility checker those tests run inside the browser) into .tools/. Quiet and idempotent: a second
# run installs nothing. Everything else comes with the .NET 10 SDK and NuGet restore.
set -euo pipefail
cd "$(dirname "$0")"
AXE_VERSION=4.14.1
missing=()
command -v pdfinfo >/dev/null && command -v pdffonts >/dev/null || missing+=(poppler-utils)
command -v qpdf >/dev/null || missing+=(qpdf)
command -v chromium >/dev/null || missing+=(chromium)
command -v npm >/dev/null || missing+=(nodejs npm)
if [ ${#missing[@]} -gt 0 ]; then
  if command -v apt-get >/dev/null; then
    SUDO=""; [ "$(id -u)" = 0 ] || SUDO="sudo"
    ($SUDO apt-get update -qq && DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq "${missing[@]}") >/dev/null 2>&1 \
      || echo "warning: could not install ${missing[*]}; the tests that need them will fail" >&2
  else
    echo "warning: install ${missing[*]} for the PDF and web page checks" >&2
  fi
fi
if [ ! -f .tools/node_modules/axe-core/axe.min.js ] || ! grep -q "\"version\": \"$AXE_VERSION\"" .tools/node_modules/axe-core/package.json; then
  mkdir -p .tools
  npm install --prefix .tools --no-save --no-audit --no-fund --silent "axe-core@$AXE_VERSION" >/dev/null 2>&1 \
    || echo "warning: could not install axe-core from npm; the accessibility test of the web page will fail" >&2
fi
dotnet test ReportBuilder.sln "$@"
