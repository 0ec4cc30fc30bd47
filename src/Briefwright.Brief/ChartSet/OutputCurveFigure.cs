using Briefwright.Charts;
using Briefwright.Model.Results;
using Briefwright.Templating;

namespace Briefwright.Brief.ChartSet;

/// <summary>
/// Output per person against years of schooling on the balanced growth path, with the options and E*.
/// </summary>
public sealed class OutputCurveFigure : IChartDefinition
{
    public IEnumerable<ChartSpec> Build(ChartContext c)
    {
        var w = c.Texts;
        var results = c.Solved.BalancedGrowth;
        yield return new ChartSpec("output-curve", SchoolingCharts.OutputCurve(c.Drawing, results, c.Styles),
            w.T("chart.curve.caption"),
            AltText(results, w), c.Source);
    }

    /// <summary>
    /// The output curve described from its computed shape: its trend, where it is highest, and where the options sit.
    /// </summary>
    public static string AltText(BalancedGrowthResults results, ChartTexts w)
    {
        var opt = results.Optimum;
        var curve = results.SchoolingCurve;
        string trend = w.Wording.Trend(curve.Select(c => c.OutputPerPerson).ToList());
        string where = opt.AtBoundary
            ? w.T("chart.curve.alt_edge", w.Years(opt.SchoolingYears))
            : w.T("chart.curve.alt_highest", w.Years(opt.SchoolingYears), w.Years(opt.Within1Pct[0]),
                w.Years(opt.Within1Pct[1]));
        var sides = results.Options.Select(o => Math.Sign(Math.Round(o.SchoolingYears - opt.SchoolingYears, 1)))
            .Distinct().ToList();
        string options = sides.Count == 1 && sides[0] < 0 ? w.T("chart.curve.alt_below")
            : sides.Count == 1 && sides[0] > 0 ? w.T("chart.curve.alt_above")
            : sides.Count == 1 ? w.T("chart.curve.alt_at")
            : w.T("chart.curve.alt_both");
        return w.T("chart.curve.alt", w.Years(opt.FeasibleMaxSchooling), trend, where, options);
    }
}
