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
        int k = a.Reform.Options.Select(o => o.OptionId).ToList().IndexOf(a.HeadlineOptionId);
        yield return new ChartSpec("distribution", AnalysisCharts.Distribution(c.Drawing, mc, k, headline, c.Styles[a.HeadlineOptionId]),
            T("chart.distribution.caption", headline, TemplateFunctions.Big(mc.Draws)),
            T("chart.distribution.alt", TemplateFunctions.Change(mc.Options[k].LongRunChangePct.P5), TemplateFunctions.Change(mc.Options[k].LongRunChangePct.P95), TemplateFunctions.Change(mc.Options[k].LongRunChangePct.P50)),
            c.Source);
    }
}
