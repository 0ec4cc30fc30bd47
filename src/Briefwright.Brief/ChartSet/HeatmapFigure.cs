using System.Globalization;
using Briefwright.Charts;
using Briefwright.Model.Uncertainty;

namespace Briefwright.Brief.ChartSet;

/// <summary>One heat map per grid of the scenario: E* or the long-run change over two parameters.</summary>
public sealed class HeatmapFigure : IChartDefinition
{
    private static string F(double v) => v.ToString("0.0", CultureInfo.InvariantCulture);

    public IEnumerable<ChartSpec> Build(ChartContext c)
    {
        var a = c.Solved.Analysis;
        string headline = c.Solved.Scenario.Inputs.Options.First(o => o.Id == a.HeadlineOptionId).Label;
        foreach (var (grid, i) in a.Grids.Select((g, i) => (g, i)))
        {
            string what = grid.Spec.Output == "optimum" ? "Output-maximising schooling E* (years)" : $"Long-run change, {headline} (%)";
            string x = Parameters.Find(grid.Spec.X)!.Label, y = Parameters.Find(grid.Spec.Y)!.Label;
            var values = grid.Values.SelectMany(v => v).Where(v => v is not null).Select(v => v!.Value).ToList();
            yield return new ChartSpec(i == 0 ? "heatmap" : $"heatmap-{i + 1}", AnalysisCharts.Heatmap(grid, Axis(grid.Spec.X, x), Axis(grid.Spec.Y, y), what, Scale(grid.Spec.X), Scale(grid.Spec.Y)),
                $"{what} over {x.ToLowerInvariant()} and {y.ToLowerInvariant()}",
                $"Heat map: {what.ToLowerInvariant()} ranges from {F(values.Min())} to {F(values.Max())} over the grid" + (grid.Invalid > 0 ? $"; {grid.Invalid} cells break a model rule and are blank." : "."),
                c.Source);
        }
    }

    private static string Axis(string parameter, string label) => Parameters.Find(parameter)!.IsRate ? label + " (%)" : label;

    private static double Scale(string parameter) => Parameters.Find(parameter)!.IsRate ? 100 : 1;
}
