#!/usr/bin/env bash
# Builds the demo briefs: every scenario in briefs-demo/ → briefs-demo/out/<id>-<date>.pdf (+ results JSON), with the web
# page (.html), the spreadsheet annex (.xlsx) and the editable document (.docx) beside each.
# Restores and compiles on first use; needs only the .NET 10 SDK.
set -euo pipefail
cd "$(dirname "$0")"
dotnet build src/Briefwright.Cli -c Release -v quiet -nologo >/dev/null
dotnet src/Briefwright.Cli/bin/Release/net10.0/briefwright.dll build briefs-demo --theme briefs-demo/auroria-institute.theme.yaml --formats pdf,html,xlsx,docx "$@"
