using Briefwright.Charts;
using Briefwright.Templating;

namespace Briefwright.Brief.ChartSet;

/// <summary>The two opposing forces, in two aligned panels over schooling length.</summary>
public sealed class OpposingForcesFigure : IChartDefinition
{
    public IEnumerable<ChartSpec> Build(ChartContext c)
    {
        var w = c.Texts;
        var results = c.Solved.BalancedGrowth;
        var curve = results.SchoolingCurve;
        var baseline = results.Options.First(o => o.IsBaseline);
        yield return new ChartSpec("opposing-forces", SchoolingCharts.OpposingForces(c.Drawing, results, c.Styles),
            w.T("chart.forces.caption"),
            w.T("chart.forces.alt", w.Wording.Trend(curve.Select(x => x.WorkerShare).ToList()),
                w.Wording.Trend(curve.Select(x => x.HumanCapitalPerWorker).ToList()),
                w.Years(baseline.SchoolingYears), w.Num(baseline.WorkerShare, 3),
                w.Num(baseline.HumanCapitalPerWorker, 2)),
            c.Source);
    }
}
