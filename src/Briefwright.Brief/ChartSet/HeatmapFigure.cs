using Briefwright.Charts;
using Briefwright.Model.Uncertainty;

namespace Briefwright.Brief.ChartSet;

/// <summary>One heat map per grid of the scenario: E* or the long-run change over two parameters.</summary>
public sealed class HeatmapFigure : IChartDefinition
{
    public IEnumerable<ChartSpec> Build(ChartContext c)
    {
        var w = c.Texts;
        var a = c.Solved.Analysis;
        string headline = c.Solved.Scenario.Inputs.Options.First(o => o.Id == a.HeadlineOptionId).Label;
        foreach (var (grid, i) in a.Grids.Select((g, i) => (g, i)))
        {
            string what = grid.Spec.Output == "optimum"
                ? w.T("chart.heatmap.optimum") : w.T("chart.heatmap.change", headline);
            string x = w.ParameterLabel(grid.Spec.X, Parameters.Find(grid.Spec.X)!.Label),
                y = w.ParameterLabel(grid.Spec.Y, Parameters.Find(grid.Spec.Y)!.Label);
            var values = grid.Values.SelectMany(v => v).Where(v => v is not null).Select(v => v!.Value).ToList();
            yield return new ChartSpec(i == 0 ? "heatmap" : $"heatmap-{i + 1}", AnalysisCharts.Heatmap(c.Drawing,
                grid, Axis(grid.Spec.X, x), Axis(grid.Spec.Y, y), what, Scale(grid.Spec.X), Scale(grid.Spec.Y)),
                w.T("chart.heatmap.caption", what, w.InSentence(x), w.InSentence(y)),
                w.T(grid.Invalid > 0 ? "chart.heatmap.alt_blank" : "chart.heatmap.alt", w.InSentence(what),
                    w.F(values.Min()), w.F(values.Max()), grid.Invalid),
                c.Source);
        }
    }

    private static string Axis(string parameter, string label)
        => Parameters.Find(parameter)!.IsRate ? label + " (%)" : label;

    private static double Scale(string parameter) => Parameters.Find(parameter)!.IsRate ? 100 : 1;
}
