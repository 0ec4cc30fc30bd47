#!/usr/bin/env bash
# Whole-process timings of `briefwright build`: the demo, a batch of 200 generated regional variants, and the
# no-op rebuild of that batch. Prints wall time and peak memory (max RSS). Run on an otherwise idle machine:
#   bench/run-timings.sh
set -euo pipefail
cd "$(dirname "$0")/.."
work=$(mktemp -d)
# The native executable (README, "Installing for scheduled jobs"): what a scheduled job should run. Publishing takes
# a minute or two. bench/check-native.sh checks that it writes the same bytes as the managed build.
rid=$(dotnet --info | awk '/^ *RID:/ { print $2; exit }')
dotnet publish src/Briefwright.Cli -c Release -r "$rid" -o "$work/bin" -v quiet -nologo >/dev/null
BW="$work/bin/briefwright"
trap 'rm -rf "$work"' EXIT

measure() { # label, command...
  local label=$1; shift
  local start end rss
  start=$(date +%s.%N)
  if [ -x /usr/bin/time ]; then
    /usr/bin/time -f "%M" -o "$work/rss" "$@" >/dev/null 2>"$work/err" || { cat "$work/err"; return 1; }
    rss=$(tail -1 "$work/rss")
  else
    "$@" >/dev/null 2>"$work/err" || { cat "$work/err"; return 1; }
    rss="n/a"
  fi
  end=$(date +%s.%N)
  printf '%-58s %8.2f s   peak %s KB\n' "$label" "$(echo "$end - $start" | bc)" "$rss"
}

# 200 invented regional variants of the invented national scenario, each with its own growth rate and retirement age.
mkdir -p "$work/regions"
cp briefs-demo/auroria-national.yaml briefs-demo/northport-life-table.csv "$work/regions/"
sed -e 's/draws: 2000/draws: 200/' -e 's/sobol_samples: [0-9]*/sobol_samples: 0/' -e 's/steps: 9/steps: 5/' \
  briefs-demo/auroria-national.yaml > "$work/regions/national-light.yaml"
mv "$work/regions/auroria-national.yaml" "$work/national-full.yaml"
for i in $(seq 1 200); do
  growth=$(echo "scale=2; -0.5 + ($i % 30) / 10" | bc)
  cat > "$work/regions/region-$(printf %03d $i).yaml" <<YAML
# INVENTED regional variant $i of the fictional Republic of Auroria (benchmark input).
extends: national-light.yaml
brief:
  id: region-$(printf %03d $i)
  title: "Longer compulsory schooling in invented region $i"
demography:
  population_growth: { value: ${growth}%, source: Invented regional projection }
  retirement_age: $((63 + i % 5))
YAML
done
rm "$work/regions/national-light.yaml.bak" 2>/dev/null || true

measure "demo: 4 briefs (whole process, cold)" $BW build briefs-demo -o "$work/demo" -q
measure "demo: national brief only (whole process)" $BW build briefs-demo/auroria-national.yaml -o "$work/one" -q --force
measure "demo: one regional brief, no chart images (whole process)" $BW build briefs-demo/auroria-silverdale.yaml -o "$work/one" -q --force --no-chart-images
measure "one generated regional brief (200 draws), whole process" $BW build "$work/regions/region-001.yaml" -o "$work/one" -q --force --no-chart-images
measure "200 regional briefs + national (light MC, no chart images)" $BW build "$work/regions" -o "$work/out" -q --no-chart-images
measure "no-op rebuild of the same 201 briefs" $BW build "$work/regions" -o "$work/out" -q --no-chart-images
measure "200 regional briefs + national, --skip-flush" $BW build "$work/regions" -o "$work/out3" -q --no-chart-images --skip-flush
measure "200 regional briefs + national (light MC, with chart images)" $BW build "$work/regions" -o "$work/out2" -q
ls "$work/out"/*.pdf | head -1 | xargs -I{} sh -c 'printf "%-58s %8s KB\n" "size of one regional brief" $(( $(stat -c %s {}) / 1024 ))'
