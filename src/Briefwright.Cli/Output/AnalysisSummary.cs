using System.Text;
using static Briefwright.Cli.Output.ConsoleNumbers;
using Briefwright.Brief;
using Briefwright.Model.Dynamics;

namespace Briefwright.Cli.Output;

/// <summary>The reform path, appraisal and uncertainty part of the <c>solve</c> summary.</summary>
public static class AnalysisSummary
{
    private static string Pct(double fraction) => N(fraction * 100, "0.00") + "%";

    public static string Render(SolvedScenario solved)
    {
        var a = solved.Analysis;
        var sb = new StringBuilder();
        var r = a.Reform;
        sb.AppendLine();
        sb.AppendLine($"Reform from {r.ReformYear}, phased in over {r.PhaseInCohorts} cohort(s), " +
            $"{r.HorizonYears}-year horizon; present values valued at {r.ValuationYear}:");
        foreach (var o in r.Options)
        {
            var p = o.Path;
            string dip = p.DipDepth is { } depth ? $"dip {Pct(depth)} in {r.ReformYear + p.DipYear}" : "no dip";
            string positive = p.FirstPositiveYear is { } fp ? $"positive from {r.ReformYear + fp}" : "never positive";
            sb.AppendLine($"  {o.OptionId}: {dip}, {positive}, long run {Pct(p.LongRunGain)} (balanced growth " +
                $"{Pct(p.BalancedGrowthGain)})");
            foreach (var pv in o.PresentValues)
            {
                string be = pv.BreakEvenYear is { } y ? $"break-even {r.ReformYear + y}" : "no break-even in horizon";
                string total = pv.Total is { } t ? $", with tail {N(t, "0.00")}" : ", tail not finite";
                sb.AppendLine($"      PV {pv.ScheduleId}: {N(pv.ToHorizon, "0.00")} years of {r.ValuationYear} " +
                    $"output per person to the horizon{total}; {be}");
            }
        }
        var d = r.Optimum;
        sb.AppendLine($"  discounted optimum ({d.ScheduleId}, " +
            $"{(d.TailIncluded ? "with the tail" : "cut at the horizon")}): {N(d.SchoolingYears, "0.0")} years (PV " +
            $"{N(d.PresentValue, "0.00")}) beside balanced-growth E* {N(d.BalancedGrowthOptimum, "0.0")} years");
        if (a.Tornado.Count > 0)
        {
            sb.AppendLine($"Sensitivity of {a.HeadlineOptionId}'s long-run change (largest swing first):");
            foreach (var t in a.Tornado)
            {
                string low = N(t.AtLow.LongRunChangeOf(a.HeadlineOptionId), "0.00");
                string high = N(t.AtHigh.LongRunChangeOf(a.HeadlineOptionId), "0.00");
                sb.AppendLine($"  {t.Parameter,-20} {low}% .. {high}%   E* {N(t.AtLow.OptimumYears, "0.0")} .. "
                    + $"{N(t.AtHigh.OptimumYears, "0.0")}");
            }
        }
        if (a.MonteCarlo is { } mc)
        {
            sb.AppendLine(
                $"Monte Carlo: {mc.Draws} draws (seed {mc.Seed}), {mc.Rejected} rejected for breaking a model rule");
            foreach (var o in mc.Options)
                sb.AppendLine($"  {o.OptionId}: change 5–95%: {N(o.LongRunChangePct.P5, "0.00")}% .. " +
                    $"{N(o.LongRunChangePct.P95, "0.00")}% (median {N(o.LongRunChangePct.P50, "0.00")}%), P(gain) " +
                    $"{P(o.ProbabilityGain)}, P(PV > 0) {P(o.ProbabilityPositivePv)}");
            sb.AppendLine($"  E* 5–95%: {N(mc.OptimumYears.P5, "0.0")} .. {N(mc.OptimumYears.P95, "0.0")} years");
        }
        if (a.Sobol is { } s) Sobol(sb, s);
        return sb.ToString();
    }

    private static void Sobol(StringBuilder sb, Model.Uncertainty.GlobalSensitivity s)
    {
        sb.AppendLine($"Sobol indices (first-order / total, {100 * s.Indices[0].Level:0}% bootstrap intervals), " +
            $"{s.Indices[0].Samples} base samples:");
        for (int i = 0; i < s.Outputs.Count; i++)
        {
            var x = s.Indices[i];
            sb.AppendLine($"  {s.Outputs[i]}: " + string.Join(", ", x.Inputs.Select((name, j) =>
                $"{name} {N(x.FirstOrder[j], "0.00")} [{N(x.FirstOrderLow[j], "0.00")}, " +
                $"{N(x.FirstOrderHigh[j], "0.00")}]/{N(x.Total[j], "0.00")} " +
                $"[{N(x.TotalLow[j], "0.00")}, {N(x.TotalHigh[j], "0.00")}]")));
        }
    }

    private static string P(Model.Uncertainty.Probability p) =>
        $"{N(p.Estimate, "0.000")} [{N(p.Low, "0.000")}, {N(p.High, "0.000")}]";
}
