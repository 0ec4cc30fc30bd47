using Briefwright.Charts;
using Briefwright.Templating;

namespace Briefwright.Brief.ChartSet;

/// <summary>The two opposing forces, in two aligned panels over schooling length.</summary>
public sealed class OpposingForcesFigure : IChartDefinition
{
    public IEnumerable<ChartSpec> Build(ChartContext c)
    {
        var results = c.Solved.BalancedGrowth;
        var curve = results.SchoolingCurve;
        var baseline = results.Options.First(o => o.IsBaseline);
        yield return new ChartSpec("opposing-forces", SchoolingCharts.OpposingForces(results, c.Styles),
            "The two opposing forces: workers per person and human capital per worker against schooling",
            $"Two line charts over the same schooling axis: as schooling lengthens, the worker share (workers per person) {Wording.Trend(curve.Select(x => x.WorkerShare).ToList())} and human capital per worker {Wording.Trend(curve.Select(x => x.HumanCapitalPerWorker).ToList())}; at the baseline of {TemplateFunctions.Years(baseline.SchoolingYears)} the worker share is {TemplateFunctions.Num(baseline.WorkerShare, 3)} and human capital per worker {TemplateFunctions.Num(baseline.HumanCapitalPerWorker, 2)}.",
            c.Source);
    }
}
