using Briefwright.Charts;
using Briefwright.Templating;

using static Briefwright.Brief.ChartSet.ChartTexts;

namespace Briefwright.Brief.ChartSet;

/// <summary>Distribution of the headline option's long-run change over the Monte Carlo draws, in its option colour.</summary>
public sealed class DistributionFigure : IChartDefinition
{
    public IEnumerable<ChartSpec> Build(ChartContext c)
    {
        var a = c.Solved.Analysis;
        if (a.MonteCarlo is not { } mc) yield break;
        string headline = c.Solved.Scenario.Inputs.Options.First(o => o.Id == a.HeadlineOptionId).Label;
        var h = c.Solved.Outcomes.Headline.Uncertainty!;
        yield return new ChartSpec("distribution",
            AnalysisCharts.Distribution(mc, h, headline, c.Styles[a.HeadlineOptionId]),
            T("chart.distribution.caption", headline, TemplateFunctions.Big(mc.Draws)),
            T("chart.distribution.alt", TemplateFunctions.Change(h.LongRunChangePct.P5),
                TemplateFunctions.Change(h.LongRunChangePct.P95), TemplateFunctions.Change(h.LongRunChangePct.P50)),
            c.Source);
    }
}
