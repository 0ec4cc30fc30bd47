using Briefwright.Charts;
using Briefwright.Model.Results;
using Briefwright.Templating;

using static Briefwright.Brief.ChartSet.ChartTexts;

namespace Briefwright.Brief.ChartSet;

/// <summary>Output per person against years of schooling on the balanced growth path, with the options and E*.</summary>
public sealed class OutputCurveFigure : IChartDefinition
{
    public IEnumerable<ChartSpec> Build(ChartContext c)
    {
        var results = c.Solved.BalancedGrowth;
        yield return new ChartSpec("output-curve", SchoolingCharts.OutputCurve(c.Drawing, results, c.Styles),
            T("chart.curve.caption"),
            AltText(results), c.Source);
    }

    /// <summary>The output curve described from its computed shape: its trend, where it is highest, and where the options sit.</summary>
    public static string AltText(BalancedGrowthResults results)
    {
        var opt = results.Optimum;
        var curve = results.SchoolingCurve;
        string trend = Wording.Trend(curve.Select(c => c.OutputPerPerson).ToList());
        string where = opt.AtBoundary
            ? T("chart.curve.alt_edge", TemplateFunctions.Years(opt.SchoolingYears))
            : T("chart.curve.alt_highest", TemplateFunctions.Years(opt.SchoolingYears), TemplateFunctions.Years(opt.Within1Pct[0]), TemplateFunctions.Years(opt.Within1Pct[1]));
        var sides = results.Options.Select(o => Math.Sign(Math.Round(o.SchoolingYears - opt.SchoolingYears, 1))).Distinct().ToList();
        string options = sides.Count == 1 && sides[0] < 0 ? T("chart.curve.alt_below")
            : sides.Count == 1 && sides[0] > 0 ? T("chart.curve.alt_above")
            : sides.Count == 1 ? T("chart.curve.alt_at")
            : T("chart.curve.alt_both");
        return T("chart.curve.alt", TemplateFunctions.Years(opt.FeasibleMaxSchooling), trend, where, options);
    }
}
