using System.Text;
using static Briefwright.Cli.Output.ConsoleNumbers;
using Briefwright.Model.Results;
using Briefwright.Scenario;
using Briefwright.Templating;

namespace Briefwright.Cli.Output;

/// <summary>The readable summary printed by <c>solve</c>.</summary>
public static class SummaryTable
{

    public static string Render(ScenarioDocument scenario, BalancedGrowthResults results)
    {
        var sb = new StringBuilder();
        sb.AppendLine($"{scenario.Brief.Title} ({scenario.Brief.Id}, {scenario.Brief.Date:yyyy-MM-dd}, " +
            $"{scenario.Brief.Status}, edition {scenario.Brief.Edition})");
        sb.AppendLine("Balanced growth path: output per effective worker " +
            $"{N(results.SteadyState.OutputPerEffectiveWorker, "0.0000")}, n + g + δ = " +
            $"{N(results.SteadyState.EffectiveDepreciation * 100, "0.00")}%");
        sb.AppendLine();
        var rows = new List<string[]>
        {
            new[] { "option", "schooling", "worker share", "h per worker", "output/person", "vs baseline" },
        };
        foreach (var o in results.Options)
            rows.Add(new[]
            {
                o.Id + (o.IsBaseline ? " (baseline)" : ""), N(o.SchoolingYears, "0.0") + " y",
                N(o.WorkerShare, "0.0000"), N(o.HumanCapitalPerWorker, "0.0000"), N(o.OutputPerPerson, "0.0000"),
                (o.ChangeVsBaselinePct >= 0 ? "+" : "") + N(o.ChangeVsBaselinePct, "0.00") + "%",
            });
        int[] widths = Enumerable.Range(0, rows[0].Length).Select(c => rows.Max(r => r[c].Length)).ToArray();
        foreach (var (row, i) in rows.Select((r, i) => (r, i)))
        {
            sb.AppendLine(string.Join("  ",
                row.Select((cell, c) => c == 0 ? cell.PadRight(widths[c]) : cell.PadLeft(widths[c]))).TrimEnd());
            if (i == 0) sb.AppendLine(string.Join("  ", widths.Select(w => new string('-', w))));
        }
        var opt = results.Optimum;
        sb.AppendLine();
        sb.AppendLine($"Output-maximising schooling E*: {N(opt.SchoolingYears, "0.00")} years " +
            $"({(opt.Method == OptimumMethod.ClosedForm ? "closed form" : "numerical search")}" +
            $"{(opt.AtBoundary ? ", at the boundary of the feasible range" : "")})");
        sb.AppendLine($"  within 1% of the maximum: {N(opt.Within1Pct[0], "0.0")} to {N(opt.Within1Pct[1], "0.0")} " +
            $"years; output per person at E*: {N(opt.OutputPerPerson, "0.0000")}");
        if (opt.ClosedFormNotApplicable is { } why)
            sb.AppendLine($"  closed form not used: {ResultWords.Data.ClosedFormReason(why)}");
        if (opt.LocalMaxima.Count > 1)
            sb.AppendLine("  local maxima: " +
                string.Join(", ", opt.LocalMaxima.Select(m => N(m.SchoolingYears, "0.00") + " y")));
        string refinement = ResultWords.Data.Refinement(opt.Diagnostics.Refinement);
        sb.AppendLine($"  solver: {opt.Diagnostics.GridPoints} grid points, "
            + $"{opt.Diagnostics.RefinementIterations} refinement steps ({refinement}), "
            + (opt.Diagnostics.Converged ? "converged" : "DID NOT CONVERGE"));
        return sb.ToString();
    }
}
