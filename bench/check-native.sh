#!/usr/bin/env bash
# Publishes the native executable (README, "Installing for scheduled jobs") and checks that it writes the same bytes
# as the managed build: every file of the demo briefs (with theme, chart copies, annex, web page, workbook and document), the output of check,
# solve --json, diff and schema, and the messages and exit code of check on every bad input of tests/corpus. Run by CI after the tests. Usage: bench/check-native.sh [output folder]
set -euo pipefail
cd "$(dirname "$0")/.."
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
native=${1:-$work/native}
# Native compilation links with the platform's C toolchain (clang or gcc, and objcopy); install it if missing.
if ! command -v clang >/dev/null && ! command -v gcc >/dev/null || ! command -v objcopy >/dev/null; then
  SUDO=$([ "$(id -u)" = 0 ] || echo sudo)
  if command -v apt-get >/dev/null; then
    ($SUDO apt-get update -qq && $SUDO apt-get install -y -qq clang binutils) >/dev/null 2>&1 || echo "warning: could not install clang" >&2
  fi
fi
rid=$(dotnet --info | awk '/^ *RID:/ { print $2; exit }')
echo "publishing the native executable for $rid ..."
dotnet publish src/Briefwright.Cli -c Release -r "$rid" -o "$native" -v quiet -nologo >/dev/null
dotnet build src/Briefwright.Cli -c Release -v quiet -nologo >/dev/null
managed=(dotnet src/Briefwright.Cli/bin/Release/net10.0/briefwright.dll)
failed=0
same() { # label, file a, file b
  if ! cmp -s "$2" "$3"; then echo "DIFFERENT: $1"; failed=1; fi
}
for who in managed native; do
  if [ $who = managed ]; then run=("${managed[@]}"); else run=("$native/briefwright"); fi
  mkdir -p "$work/$who"
  "${run[@]}" build briefs-demo --theme briefs-demo/auroria-institute.theme.yaml --formats pdf,html,xlsx,docx -o "$work/$who/briefs" -q
  "${run[@]}" check briefs-demo > "$work/$who/check.txt"
  "${run[@]}" solve briefs-demo/auroria-national.yaml briefs-demo/auroria-northport.yaml --json > "$work/$who/solve.json"
  "${run[@]}" solve briefs-demo/auroria-silverdale.yaml > "$work/$who/solve.txt"
  "${run[@]}" diff briefs-demo/auroria-national.yaml briefs-demo/auroria-eastmark.yaml > "$work/$who/diff.txt" || true
  "${run[@]}" schema > "$work/$who/schema.json"
  # Every bad input of the test corpus: the same messages and exit codes.
  for f in tests/corpus/*; do
    code=0; "${run[@]}" check "$f" > "$work/$who/corpus-$(basename "$f").txt" 2>&1 || code=$?
    echo "exit $code" >> "$work/$who/corpus-$(basename "$f").txt"
  done
done
count=0
for f in "$work/managed/briefs"/*.* "$work/managed"/*.*; do
  name=${f#"$work/managed/"}
  [ "$(basename "$f")" = build-log.jsonl ] && continue # holds build times
  same "$name" "$f" "$work/native/$name"
  count=$((count + 1))
done
[ "$(ls "$work/managed/briefs" | wc -l)" = "$(ls "$work/native/briefs" | wc -l)" ] || { echo "DIFFERENT: number of files"; failed=1; }
if [ $failed = 0 ]; then echo "native executable: $count files and outputs identical to the managed build"; fi
exit $failed
