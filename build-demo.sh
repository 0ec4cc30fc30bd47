#!/usr/bin/env bash
# Builds the demo: every scenario in briefs-demo/. Restores and compiles on first use.
set -euo pipefail
cd "$(dirname "$0")"
dotnet build src/Briefwright.Cli -c Release -v quiet -nologo >/dev/null
dotnet src/Briefwright.Cli/bin/Release/net10.0/briefwright.dll check briefs-demo
dotnet src/Briefwright.Cli/bin/Release/net10.0/briefwright.dll solve briefs-demo
