using ScottPlot;

namespace Briefwright.Charts;

/// <summary>
/// A chart as drawn: one plot, or several stacked with the same padding so their data areas line up (two aligned
/// panels instead of a second y-axis). <see cref="Shares"/> gives each panel's share of the height.
/// </summary>
public sealed class ChartPanels
{
    public IReadOnlyList<Plot> Plots { get; }
    public IReadOnlyList<double> Shares { get; }

    public ChartPanels(IReadOnlyList<Plot> plots, IReadOnlyList<double>? shares = null)
    {
        if (plots.Count == 0) throw new ArgumentException("A chart needs at least one plot.", nameof(plots));
        Plots = plots;
        Shares = shares ?? plots.Select(_ => 1.0 / plots.Count).ToList();
    }

    public static implicit operator ChartPanels(Plot plot) => new(new[] { plot });

    /// <summary>Every plottable of every panel.</summary>
    public IEnumerable<IPlottable> Plottables => Plots.SelectMany(p => p.GetPlottables());
}
