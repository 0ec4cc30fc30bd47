#!/usr/bin/env python3
"""Writes the bad-input corpus: each file breaks exactly one rule of a valid base scenario.
Run from this folder; expected messages live in expected.tsv (checked by CorpusTests)."""
import os

BASE = """brief:
  id: corpus-base
  title: Corpus base (invented)
  organisation: Corpus Institute (invented)
  date: 2026-11-30
demography:
  population_growth: 1%
  school_entry_age: 6
  retirement_age: 65
  participation: 75%
  survival:
    form: rectangular
    max_age: 80
human_capital:
  returns:
    form: constant
    rate: 8%
production:
  saving_rate: 20%
  capital_share: 0.33
  depreciation: 3%
  technology_growth: 2%
options:
  - id: base
    label: Base
    schooling_years: 11
  - id: more
    label: More
    schooling_years: 12
"""

cases = {}
def sub(name, find, repl):
    assert find in BASE, (name, find)
    cases[name] = BASE.replace(find, repl, 1)

# --- malformed YAML
cases["yaml-unclosed-flow"] = BASE.replace("  depreciation: 3%", "  depreciation: [3%")
cases["yaml-unclosed-quote"] = BASE.replace("title: Corpus base (invented)", 'title: "Corpus base')
cases["yaml-bad-indent"] = BASE.replace("  school_entry_age: 6", "    school_entry_age: 6\n  x")
cases["yaml-tab-indent"] = BASE.replace("  retirement_age: 65", "\tretirement_age: 65")
cases["yaml-two-documents"] = BASE + "---\nbrief: {}\n"
cases["yaml-scalar-root"] = "just some text\n"
cases["yaml-list-root"] = "- a\n- b\n"
cases["yaml-mapping-key"] = BASE.replace("  saving_rate: 20%", "  ? [a, b]\n  : 1\n  saving_rate: 20%")
cases["yaml-undefined-alias"] = BASE.replace("  saving_rate: 20%", "  saving_rate: *nothing")
cases["yaml-bad-escape"] = BASE.replace("title: Corpus base (invented)", 'title: "bad \\q escape"')
# --- duplicates
sub("dup-top-level", "production:\n", "brief:\n  id: again\nproduction:\n")
sub("dup-demography-key", "  retirement_age: 65\n", "  retirement_age: 65\n  retirement_age: 66\n")
sub("dup-option-key", "    label: More\n", "    label: More\n    label: Again\n")
sub("dup-survival-key", "    max_age: 80\n", "    max_age: 80\n    max_age: 81\n")
# --- empty / binary
cases["empty"] = ""
cases["whitespace-only"] = "   \n\n  \n"
cases["comments-only"] = "# nothing here\n# at all\n"
# --- deep nesting and alias bombs
cases["deep-nesting"] = BASE + "extra:" + "".join("\n" + "  " * (i + 1) + f"k{i}:" for i in range(40)) + " 1\n"
cases["alias-bomb"] = "a: &a [x, x, x, x, x, x, x, x, x, x]\n" + "".join(f"b{i}: &b{i} [*{'a' if i == 0 else 'b' + str(i-1)}, *{'a' if i == 0 else 'b' + str(i-1)}, *{'a' if i == 0 else 'b' + str(i-1)}]\n" for i in range(100)) + BASE
# --- numbers
sub("nan", "  saving_rate: 20%", "  saving_rate: NaN")
sub("infinity", "  capital_share: 0.33", "  capital_share: Infinity")
sub("yaml-inf", "  capital_share: 0.33", "  capital_share: .inf")
sub("overlong-number", "  depreciation: 3%", "  depreciation: 0.0300000000000000000000000000000000001")
sub("quoted-number", "  saving_rate: 20%", '  saving_rate: "20%"')
sub("number-with-comma", "  capital_share: 0.33", "  capital_share: 0,33")
sub("percent-on-age", "  retirement_age: 65", "  retirement_age: 65%")
sub("text-for-number", "  school_entry_age: 6", "  school_entry_age: six")
sub("list-for-number", "  saving_rate: 20%", "  saving_rate: [20%]")
sub("mapping-for-number", "  saving_rate: 20%", "  saving_rate: { amount: 20% }")
sub("wrapped-without-value", "  saving_rate: 20%", "  saving_rate: { source: Accounts }")
sub("wrapped-unknown-key", "  saving_rate: 20%", "  saving_rate: { value: 20%, sorce: Accounts }")
# --- wrong types for sections
sub("demography-as-list", "demography:\n", "demography: [1, 2]\ndemography_old:\n")
sub("options-as-mapping", "options:\n", "options: {}\noptions_old:\n")
sub("option-as-scalar", "  - id: more\n    label: More\n    schooling_years: 12\n", "  - more\n")
sub("brief-as-scalar", "brief:\n  id: corpus-base\n  title: Corpus base (invented)\n  organisation: Corpus Institute (invented)\n  date: 2026-11-30\n", "brief: corpus\n")
sub("survival-as-scalar", "  survival:\n    form: rectangular\n    max_age: 80\n", "  survival: rectangular\n")
sub("baseline-not-boolean", "    schooling_years: 11\n", "    schooling_years: 11\n    baseline: maybe\n")
# --- unknown keys
sub("unknown-top-level", "production:\n", "producton_notes: x\nproduction:\n")
sub("unknown-brief-key", "  date: 2026-11-30\n", "  date: 2026-11-30\n  titel: x\n")
sub("unknown-demography-key", "  retirement_age: 65\n", "  retirement_age: 65\n  retirment_age: 66\n")
sub("unknown-survival-key", "    max_age: 80\n", "    max_age: 80\n    max_ages: 81\n")
sub("unknown-returns-key", "    rate: 8%\n", "    rate: 8%\n    rates: 9%\n")
sub("unknown-production-key", "  technology_growth: 2%\n", "  technology_growth: 2%\n  tfp_growth: 1%\n")
sub("unknown-option-key", "    schooling_years: 12\n", "    schooling_years: 12\n    schooling_year: 13\n")
sub("unknown-experience-key", "production:\n", "  experience: { linear: 0.08, quadratc: 0.001 }\nproduction:\n")
sub("unknown-reform-key", "options:\n", "reform: { yeer: 2030 }\noptions:\n")
sub("unknown-uncertainty-key", "options:\n", "uncertainty: { seed: 1, draw: 10, parameters: { saving_rate: { distribution: uniform, low: 10%, high: 30% } } }\noptions:\n")
# --- missing required
sub("missing-brief", "brief:\n  id: corpus-base\n  title: Corpus base (invented)\n  organisation: Corpus Institute (invented)\n  date: 2026-11-30\n", "")
sub("missing-title", "  title: Corpus base (invented)\n", "")
sub("missing-date", "  date: 2026-11-30\n", "")
sub("missing-growth", "  population_growth: 1%\n", "")
sub("missing-survival", "  survival:\n    form: rectangular\n    max_age: 80\n", "")
sub("missing-survival-form", "    form: rectangular\n", "")
sub("missing-saving-rate", "  saving_rate: 20%\n", "")
sub("missing-options", "options:\n  - id: base\n    label: Base\n    schooling_years: 11\n  - id: more\n    label: More\n    schooling_years: 12\n", "")
sub("missing-option-label", "    label: More\n", "")
sub("missing-returns-rate", "    rate: 8%\n", "")
# --- out of range, one per field
sub("growth-too-high", "  population_growth: 1%", "  population_growth: 15%")
sub("growth-too-low", "  population_growth: 1%", "  population_growth: -11%")
sub("entry-age-negative", "  school_entry_age: 6", "  school_entry_age: -1")
sub("entry-age-too-high", "  school_entry_age: 6", "  school_entry_age: 31")
sub("retirement-zero", "  retirement_age: 65", "  retirement_age: 0")
sub("participation-zero", "  participation: 75%", "  participation: 0")
sub("participation-over-one", "  participation: 75%", "  participation: 110%")
sub("max-age-too-high", "    max_age: 80", "    max_age: 200")
sub("return-zero", "    rate: 8%", "    rate: 0%")
sub("return-over-one", "    rate: 8%", "    rate: 120%")
sub("saving-zero", "  saving_rate: 20%", "  saving_rate: 0")
sub("saving-one", "  saving_rate: 20%", "  saving_rate: 1")
sub("capital-share-one", "  capital_share: 0.33", "  capital_share: 1")
sub("capital-share-negative", "  capital_share: 0.33", "  capital_share: -0.2")
sub("depreciation-negative", "  depreciation: 3%", "  depreciation: -1%")
sub("technology-too-high", "  technology_growth: 2%", "  technology_growth: 12%")
sub("schooling-negative", "    schooling_years: 11", "    schooling_years: -1")
sub("schooling-too-long", "    schooling_years: 12", "    schooling_years: 41")
sub("edition-zero", "  date: 2026-11-30\n", "  date: 2026-11-30\n  edition: 0\n")
sub("edition-fraction", "  date: 2026-11-30\n", "  date: 2026-11-30\n  edition: 1.5\n")
sub("status-unknown", "  date: 2026-11-30\n", "  date: 2026-11-30\n  status: published\n")
sub("date-invalid", "  date: 2026-11-30", "  date: 2026-02-30")
sub("date-wrong-format", "  date: 2026-11-30", "  date: 30.11.2026")
sub("survival-form-unknown", "    form: rectangular", "    form: exponential")
sub("returns-form-unknown", "    form: constant", "    form: linear")
# --- ids that would escape the output folder
sub("id-with-slash", "  id: corpus-base", "  id: ../../etc/passwd")
sub("id-with-dotdot", "  id: corpus-base", "  id: ..")
sub("id-with-backslash", "  id: corpus-base", "  id: a\\\\b")
sub("id-upper-case", "  id: corpus-base", "  id: Corpus")
sub("option-id-with-slash", "  - id: more", "  - id: more/less")
# --- contradictory parameters
sub("entry-plus-schooling-reaches-retirement", "    schooling_years: 12", "    schooling_years: 40\n    retirement_age: 46")
sub("retirement-after-max-age", "    max_age: 80", "    max_age: 60")
sub("entry-after-retirement", "  school_entry_age: 6", "  school_entry_age: 30\n  # entry after retirement")
cases["entry-after-retirement"] = BASE.replace("  retirement_age: 65", "  retirement_age: 25").replace("  school_entry_age: 6", "  school_entry_age: 28")
sub("option-retirement-after-max-age", "    schooling_years: 12", "    schooling_years: 12\n    retirement_age: 90")
sub("dilution-not-positive", "  depreciation: 3%\n  technology_growth: 2%", "  depreciation: 0%\n  technology_growth: -2%")
sub("duplicate-option-id", "  - id: more", "  - id: base")
cases["two-baselines"] = BASE.replace("    schooling_years: 11\n", "    schooling_years: 11\n    baseline: true\n").replace("    schooling_years: 12\n", "    schooling_years: 12\n    baseline: true\n")
sub("one-option-only", "  - id: more\n    label: More\n    schooling_years: 12\n", "")
sub("brackets-not-increasing", "    form: constant\n    rate: 8%\n", "    form: brackets\n    brackets:\n      - { from: 0, rate: 10% }\n      - { from: 8, rate: 7% }\n      - { from: 4, rate: 6% }\n")
sub("brackets-not-from-zero", "    form: constant\n    rate: 8%\n", "    form: brackets\n    brackets:\n      - { from: 2, rate: 10% }\n")
sub("brackets-empty", "    form: constant\n    rate: 8%\n", "    form: brackets\n    brackets: []\n")
sub("gompertz-b-negative", "    form: rectangular\n    max_age: 80", "    form: gompertz_makeham\n    a: 0.0002\n    b: -0.00001\n    c: 1.1")
sub("gompertz-c-below-one", "    form: rectangular\n    max_age: 80", "    form: gompertz_makeham\n    a: 0.0002\n    b: 0.00001\n    c: 0.9")
sub("gompertz-a-negative", "    form: rectangular\n    max_age: 80", "    form: gompertz_makeham\n    a: -0.0002\n    b: 0.00001\n    c: 1.1")
sub("power-psi-one", "    form: constant\n    rate: 8%", "    form: power\n    theta: 0.32\n    psi: 1")
# --- extends
cases["extends-missing"] = "extends: no-such-parent.yaml\nbrief:\n  id: child\n"
cases["extends-cycle-a"] = "extends: extends-cycle-b.yaml\n"
cases["extends-cycle-b"] = "extends: extends-cycle-a.yaml\n"
cases["extends-self"] = "extends: extends-self.yaml\n"
cases["extends-not-a-path"] = "extends: [a, b]\n"
cases["extends-child-breaks-rule"] = "extends: good-parent.yaml\nproduction:\n  saving_rate: 150%\n"
cases["good-parent"] = None  # written below, not a case
# --- life tables
for name, table in {
    "lifetable-increasing": "age,survivors\n0,100000\n50,90000\n60,95000\n100,0\n",
    "lifetable-not-from-zero": "age,survivors\n5,100000\n50,90000\n100,0\n",
    "lifetable-ages-not-increasing": "age,survivors\n0,100000\n50,90000\n40,80000\n100,0\n",
    "lifetable-negative": "age,survivors\n0,100000\n50,-5\n100,0\n",
    "lifetable-text": "age,survivors\n0,100000\n50,many\n100,0\n",
    "lifetable-three-columns": "age,survivors,extra\n0,100000,1\n100,0,1\n",
    "lifetable-one-row": "age,survivors\n0,100000\n",
    "lifetable-age-too-high": "age,survivors\n0,100000\n50,90000\n999999999999,0\n",
}.items():
    cases[name] = BASE.replace("    form: rectangular\n    max_age: 80", f"    form: life_table\n    file: {name}.csv")
    open(f"{name}.csv", "w").write(table)
cases["lifetable-missing-file"] = BASE.replace("    form: rectangular\n    max_age: 80", "    form: life_table\n    file: no-such-table.csv")
# --- analysis sections
sub("sensitivity-unknown-parameter", "options:\n", "sensitivity:\n  ranges:\n    saving: [10%, 20%]\noptions:\n")
sub("sensitivity-range-reversed", "options:\n", "sensitivity:\n  ranges:\n    saving_rate: [30%, 20%]\noptions:\n")
sub("sensitivity-range-one-value", "options:\n", "sensitivity:\n  ranges:\n    saving_rate: [30%]\noptions:\n")
sub("grid-same-axes", "options:\n", "sensitivity:\n  grids:\n    - { x: saving_rate, x_range: [10%, 30%], y: saving_rate, y_range: [10%, 30%] }\noptions:\n")
sub("grid-too-many-steps", "options:\n", "sensitivity:\n  grids:\n    - { x: saving_rate, x_range: [10%, 30%], y: capital_share, y_range: [0.2, 0.4], steps: 100 }\noptions:\n")
sub("uncertainty-no-seed", "options:\n", "uncertainty:\n  parameters:\n    saving_rate: { distribution: uniform, low: 10%, high: 30% }\noptions:\n")
sub("uncertainty-too-many-draws", "options:\n", "uncertainty:\n  seed: 1\n  draws: 1000000\n  parameters:\n    saving_rate: { distribution: uniform, low: 10%, high: 30% }\noptions:\n")
sub("uncertainty-unknown-distribution", "options:\n", "uncertainty:\n  seed: 1\n  parameters:\n    saving_rate: { distribution: beta, low: 10%, high: 30% }\noptions:\n")
sub("uncertainty-uniform-reversed", "options:\n", "uncertainty:\n  seed: 1\n  parameters:\n    saving_rate: { distribution: uniform, low: 30%, high: 10% }\noptions:\n")
sub("uncertainty-triangular-mode-outside", "options:\n", "uncertainty:\n  seed: 1\n  parameters:\n    retirement_age: { distribution: triangular, low: 60, mode: 70, high: 66 }\noptions:\n")
sub("uncertainty-sd-zero", "options:\n", "uncertainty:\n  seed: 1\n  parameters:\n    saving_rate: { distribution: normal, mean: 20%, sd: 0 }\noptions:\n")
sub("uncertainty-no-parameters", "options:\n", "uncertainty:\n  seed: 1\n  parameters: {}\noptions:\n")
sub("reform-headline-unknown", "options:\n", "reform:\n  headline_option: nothing\noptions:\n")
sub("reform-horizon-too-long", "options:\n", "reform:\n  horizon_years: 1000\noptions:\n")
sub("appraisal-unknown-schedule", "options:\n", "appraisal:\n  discount_rates: [green_paper]\noptions:\n")
sub("appraisal-schedule-not-from-one", "options:\n", "appraisal:\n  discount_rates:\n    - { id: x, label: X, schedule: [ { from_year: 5, rate: 3% } ] }\noptions:\n")

# --- files outside the project folder, of the wrong kind, or not scenarios (never read, never quoted)
cases["extends-absolute"] = "extends: /etc/shadow.yaml\nbrief:\n  id: child\n"
cases["extends-proc"] = "extends: /proc/self/environ\n"
cases["extends-dotdot"] = "extends: ../../outside.yaml\n"
cases["extends-not-a-scenario"] = "extends: generate.py\n"
cases["lifetable-absolute"] = BASE.replace("    form: rectangular\n    max_age: 80", "    form: life_table\n    file: /etc/table.csv")
cases["lifetable-dotdot"] = BASE.replace("    form: rectangular\n    max_age: 80", "    form: life_table\n    file: ../table.csv")
cases["lifetable-not-csv"] = BASE.replace("    form: rectangular\n    max_age: 80", "    form: life_table\n    file: expected.tsv")
# --- what the model cannot solve, caught by check
cases["lifetable-everyone-dies-at-one"] = BASE.replace("    form: rectangular\n    max_age: 80", "    form: life_table\n    file: lifetable-everyone-dies-at-one.csv")
open("lifetable-everyone-dies-at-one.csv", "w").write("age,survivors\n0,1000\n1,0\n100,0\n")
sub("saving-tiny-capital-share-high", "  saving_rate: 20%\n  capital_share: 0.33", "  saving_rate: 1e-300\n  capital_share: 0.99")
sub("capital-share-near-one", "  capital_share: 0.33", "  capital_share: 0.9999999")
cases["dilution-tiny"] = BASE.replace("  population_growth: 1%", "  population_growth: -5%").replace("  technology_growth: 2%", "  technology_growth: 5%").replace("  depreciation: 3%", "  depreciation: 1e-300")
sub("sensitivity-entry-age-outside", "options:\n", "sensitivity:\n  ranges:\n    school_entry_age: [0, 64]\noptions:\n")
sub("sensitivity-range-breaks-rule", "options:\n", "sensitivity:\n  ranges:\n    population_growth: [-10%, 1%]\noptions:\n")
sub("sensitivity-depreciation-full", "options:\n", "sensitivity:\n  ranges:\n    depreciation: [0, 100%]\noptions:\n")
sub("grid-corner-breaks-rule", "options:\n", "sensitivity:\n  grids:\n    - { x: population_growth, x_range: [-2%, 1%], y: technology_growth, y_range: [-2%, 2%] }\noptions:\n")
sub("uncertainty-sd-huge", "options:\n", "uncertainty:\n  seed: 1\n  parameters:\n    saving_rate: { distribution: normal, mean: 20%, sd: 1000 }\noptions:\n")
sub("uncertainty-uniform-outside-rule", "options:\n", "uncertainty:\n  seed: 1\n  parameters:\n    capital_share: { distribution: uniform, low: 0.2, high: 0.99 }\noptions:\n")
sub("uncertainty-work-too-large", "options:\n", "reform:\n  horizon_years: 400\nuncertainty:\n  seed: 1\n  draws: 200000\n  sobol_samples: 8192\n  parameters:\n    saving_rate: { distribution: uniform, low: 10%, high: 30% }\noptions:\n")
sub("reform-default-year-out-of-range", "  date: 2026-11-30", "  date: 2300-06-30")
# --- ids, tags, floods
sub("id-with-newline", "  id: corpus-base", '  id: "corpus\\n"')
sub("tagged-string-number", "  saving_rate: 20%", "  saving_rate: !!str 0.2")
sub("tagged-unknown", "  saving_rate: 20%", "  saving_rate: !custom 0.2")
cases["unknown-keys-flood"] = BASE + "".join(f"k{i}: 1\n" for i in range(20000))
# --- extends: a child that switches a distribution replaces the parent's (the parent is .yml: not a case of its own)
open("uncertainty-parent.yml", "w").write(BASE.replace("options:\n", "uncertainty:\n  seed: 1\n  parameters:\n    saving_rate: { distribution: uniform, low: 10%, high: 30% }\noptions:\n"))
cases["extends-child-switches-distribution"] = "extends: uncertainty-parent.yml\nuncertainty:\n  parameters:\n    saving_rate: { distribution: normal, mean: 20% }\n"

os.makedirs(".", exist_ok=True)
for name, text in cases.items():
    if text is None: continue
    with open(f"{name}.yaml", "w", newline="\n") as f: f.write(text)
open("good-parent.yaml", "w").write(BASE)
with open("binary.yaml", "wb") as f: f.write(bytes(range(256)) * 4)
with open("utf16.yaml", "wb") as f: f.write("brief:\n  id: x\n".encode("utf-16"))
# templates and themes
templates = {
    "template-syntax-error": "# {{ brief.title }}\n\n{{ if }}\n",
    "template-unknown-name": "# {{ brief.title }}\n\n{{ brief.no_such_field }}\n",
    "template-unknown-function": "# {{ brief.title }}\n\n{{ shout brief.title }}\n",
    "template-endless-loop": "# Title\n\n{{ while true }}x{{ end }}\n",
    "template-endless-recursion": "# Title\n\n{{ func f; ret f; end }}{{ f }}\n",
    "template-include-file": "# Title\n\n{{ include '/etc/passwd' }}\n",
    "template-clock": "# Title\n\n{{ date.now }}\n",
    "template-random": "# Title\n\n{{ math.random 1 6 }}\n",
    "template-environment": "# Title\n\n{{ environment.HOME }}\n",
    "template-unknown-figure": "# Title\n\n{{ figure \"pie-chart\" }}\n",
    "template-unclosed-block": "# Title\n\n{{ for o in options }}\n{{ o.label }}\n",
    "template-unknown-directive": "# Title\n\n[[chart: something]]\n",
    "template-big-number": "# Title\n\n{{ big 1 999999999 | string.size }}\n",
    "template-double-recursion": "# Title\n\n{{ func f(n); if n > 0; f(n - 1); f(n - 1); end; end; f 40 }}\n",
    "template-text-doubling": "# Title\n\n{{ x = 'abcdefgh'; for i in 1..40; x = x + x; end; x | string.size }}\n",
    "template-huge-range": "# Title\n\n{{ (1..1000000000) | array.size }}\n",
    "template-huge-padding": "# Title\n\n{{ 'x' | string.pad_left 1000000000 }}\n",
    "template-file-link": "# Title\n\nSee [the memo](file:///etc/passwd).\n",
}
for name, text in templates.items(): open(f"{name}.md", "w").write(text)
themes = {
    "theme-bad-colour": "name: T\ncolours:\n  accent: blue\n",
    "theme-unknown-key": "name: T\nfont_size: 12\n",
    "theme-no-name": "paper: a4\n",
    "theme-bad-paper": "name: T\npaper: a3\n",
    "theme-logo-not-png": "name: T\nlogo: logo.jpg\n",
    "theme-unknown-colour": "name: T\ncolours:\n  background: \"#FFFFFF\"\n",
    "theme-empty": "",
    "theme-logo-absolute": "name: T\nlogo: /etc/logo.png\n",
    "theme-logo-dotdot": "name: T\nlogo: ../logo.png\n",
    "theme-logo-truncated": "name: T\nlogo: theme-truncated.png\n",
    "theme-logo-16-bit": "name: T\nlogo: theme-16-bit.png\n",
    "theme-logo-huge": "name: T\nlogo: theme-huge.png\n",
    "theme-font-truncated": "name: T\nfonts:\n  regular: theme-truncated.ttf\n",
    "theme-font-cff": "name: T\nfonts:\n  regular: theme-cff.ttf\n",
}
import struct, zlib
def chunk(t, d): return struct.pack(">I", len(d)) + t + d + struct.pack(">I", zlib.crc32(t + d) & 0xffffffff)
def png(w, h, depth=8, rows=None):
    raw = rows if rows is not None else (b"\0" + b"\x80" * (w * 4 * depth // 8)) * h
    return b"\x89PNG\r\n\x1a\n" + chunk(b"IHDR", struct.pack(">IIBBBBB", w, h, depth, 6, 0, 0, 0)) + chunk(b"IDAT", zlib.compress(raw)) + chunk(b"IEND", b"")
whole = png(40, 20)
open("theme-truncated.png", "wb").write(whole[:len(whole) // 2])
open("theme-16-bit.png", "wb").write(png(40, 20, depth=16))
open("theme-huge.png", "wb").write(png(30000, 30000, rows=b""))
ttf = open("../../fonts/LiberationSans-Regular.ttf", "rb").read()
open("theme-truncated.ttf", "wb").write(ttf[:2048])
open("theme-cff.ttf", "wb").write(b"OTTO" + bytes(60))
for name, text in themes.items(): open(f"{name}.theme.yaml", "w").write(text)
print(len([c for c in cases.values() if c is not None]) + 2 + len(templates) + len(themes), "corpus files")
