using Briefwright.Charts;
using Briefwright.Templating;

using static Briefwright.Brief.ChartSet.ChartTexts;

namespace Briefwright.Brief.ChartSet;

/// <summary>The two opposing forces, in two aligned panels over schooling length.</summary>
public sealed class OpposingForcesFigure : IChartDefinition
{
    public IEnumerable<ChartSpec> Build(ChartContext c)
    {
        var results = c.Solved.BalancedGrowth;
        var curve = results.SchoolingCurve;
        var baseline = results.Options.First(o => o.IsBaseline);
        yield return new ChartSpec("opposing-forces", SchoolingCharts.OpposingForces(c.Drawing, results, c.Styles),
            T("chart.forces.caption"),
            T("chart.forces.alt", Wording.Trend(curve.Select(x => x.WorkerShare).ToList()), Wording.Trend(curve.Select(x => x.HumanCapitalPerWorker).ToList()),
                TemplateFunctions.Years(baseline.SchoolingYears), TemplateFunctions.Num(baseline.WorkerShare, 3), TemplateFunctions.Num(baseline.HumanCapitalPerWorker, 2)),
            c.Source);
    }
}
