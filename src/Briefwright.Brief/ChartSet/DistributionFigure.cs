using Briefwright.Charts;
using Briefwright.Templating;

namespace Briefwright.Brief.ChartSet;

/// <summary>Distribution of the headline option's long-run change over the Monte Carlo draws, in its option colour.</summary>
public sealed class DistributionFigure : IChartDefinition
{
    public IEnumerable<ChartSpec> Build(ChartContext c)
    {
        var a = c.Solved.Analysis;
        if (a.MonteCarlo is not { } mc) yield break;
        string headline = c.Solved.Scenario.Inputs.Options.First(o => o.Id == a.HeadlineOptionId).Label;
        int k = a.Reform.Options.Select(o => o.OptionId).ToList().IndexOf(a.HeadlineOptionId);
        yield return new ChartSpec("distribution", AnalysisCharts.Distribution(mc, k, headline, c.Styles[a.HeadlineOptionId]),
            $"Distribution of the long-run change for {headline} over {mc.Draws:N0} Monte Carlo draws",
            $"Histogram: the long-run change lies between {TemplateFunctions.Change(mc.Options[k].LongRunChangePct.P5)} and {TemplateFunctions.Change(mc.Options[k].LongRunChangePct.P95)} in 90% of draws, median {TemplateFunctions.Change(mc.Options[k].LongRunChangePct.P50)}.",
            c.Source);
    }
}
