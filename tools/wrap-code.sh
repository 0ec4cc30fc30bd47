#!/usr/bin/env bash
# Wraps long code lines in one folder of one project with the code fix of the analyzer rule RCS0056
# (Roslynator.Formatting.Analyzers, served at the version below): breaks at arguments, parameters, binary operators
# and member access, in the style `dotnet format` writes. The package is referenced only while this runs: it adds
# it to Directory.Packages.props and switches the rule on for the folder in .editorconfig, runs
# `dotnet format analyzers`, then puts both files back as they were.
#
# Usage: tools/wrap-code.sh PROJECT_DIR FOLDER [FOLDER ...]
#   e.g. tools/wrap-code.sh src/Briefwright.Brief src/Briefwright.Brief/Formats
#
# RCS0056 leaves alone comments and lines that end in a long string literal: run tools/rewrap-comments.py and
# tools/split-strings.py for those, then tools/long-lines.py for what is left. Review the diff: the fix is
# mechanical and sometimes breaks a line in an odd place (a short `if` whose statement stays on the condition's
# last line, a member access cut after its object); fix those by hand. When it prints "Unable to fix RCS0056 ...
# didn't return a Fix All action", run it again with one file at a time as FOLDER.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
project="$1"; shift
[ $# -ge 1 ] || { echo "usage: $0 PROJECT_DIR FOLDER [FOLDER ...]" >&2; exit 2; }
version=5.0.1
cp Directory.Packages.props /tmp/wrap-code.props.$$
cp .editorconfig /tmp/wrap-code.editorconfig.$$
restore() {
  cp /tmp/wrap-code.props.$$ Directory.Packages.props
  cp /tmp/wrap-code.editorconfig.$$ .editorconfig
  rm -f /tmp/wrap-code.props.$$ /tmp/wrap-code.editorconfig.$$
}
trap restore EXIT
sed -i "s#</Project>#  <ItemGroup><GlobalPackageReference Include=\"Roslynator.Formatting.Analyzers\" Version=\"$version\" /></ItemGroup>\n</Project>#" Directory.Packages.props
printf '\n[*.cs]\nroslynator_max_line_length = 120\n' >> .editorconfig
includes=()
for folder in "$@"; do
  printf '\n[%s/**.cs]\ndotnet_diagnostic.RCS0056.severity = warning\n' "${folder%/}" >> .editorconfig
  includes+=("${folder%/}/")
done
dotnet format analyzers "$project" --diagnostics RCS0056 --severity info --include "${includes[@]}"
