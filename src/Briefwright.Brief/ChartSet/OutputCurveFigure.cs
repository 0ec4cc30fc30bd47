using Briefwright.Charts;
using Briefwright.Model.Results;
using Briefwright.Templating;

namespace Briefwright.Brief.ChartSet;

/// <summary>Output per person against years of schooling on the balanced growth path, with the options and E*.</summary>
public sealed class OutputCurveFigure : IChartDefinition
{
    public IEnumerable<ChartSpec> Build(ChartContext c)
    {
        var results = c.Solved.BalancedGrowth;
        yield return new ChartSpec("output-curve", SchoolingCharts.OutputCurve(results, c.Styles),
            "Output per person against years of schooling, once the economy has adjusted (balanced growth path)",
            AltText(results), c.Source);
    }

    /// <summary>The output curve described from its computed shape: its trend, where it is highest, and where the options sit.</summary>
    public static string AltText(BalancedGrowthResults results)
    {
        var opt = results.Optimum;
        var curve = results.SchoolingCurve;
        string trend = Wording.Trend(curve.Select(c => c.OutputPerPerson).ToList());
        string where = opt.AtBoundary
            ? $"It is highest at the edge of the range, at {TemplateFunctions.Years(opt.SchoolingYears)}."
            : $"It is highest at {TemplateFunctions.Years(opt.SchoolingYears)}; lengths from {TemplateFunctions.Years(opt.Within1Pct[0])} to {TemplateFunctions.Years(opt.Within1Pct[1])} come within 1% of that.";
        var sides = results.Options.Select(o => Math.Sign(Math.Round(o.SchoolingYears - opt.SchoolingYears, 1))).Distinct().ToList();
        string options = sides.Count == 1 && sides[0] < 0 ? "Every option lies below the output-maximising length."
            : sides.Count == 1 && sides[0] > 0 ? "Every option lies above the output-maximising length."
            : sides.Count == 1 ? "Every option lies at the output-maximising length."
            : "The options lie on both sides of the output-maximising length.";
        return $"Line chart of output per person against years of schooling from 0 to {TemplateFunctions.Years(opt.FeasibleMaxSchooling)}: as schooling lengthens, output per person {trend}. {where} {options}";
    }
}
