using Briefwright.Charts;

namespace Briefwright.Brief.ChartSet;

/// <summary>What every chart definition is given: the solved scenario, the options' styles for this brief, the source
/// line, what the brief's charts are drawn with (their font and words), and the brief's words for captions and
/// alternative texts.</summary>
public sealed record ChartContext(
    SolvedScenario Solved, OptionStyles Styles, string Source, ChartDrawing Drawing, ChartTexts Texts);

/// <summary>
/// One chart of the brief, defined in one place: its id, plot, caption, alternative text and source. A definition
/// gives no chart when the scenario has nothing for it, or several (one heat map per grid).
/// </summary>
public interface IChartDefinition
{
    IEnumerable<ChartSpec> Build(ChartContext context);
}

/// <summary>
/// Every chart of the brief, in the order they are drawn. Adding a chart is one file with its definition and one line
/// here.
/// </summary>
public static class ChartCatalogue
{
    public static readonly IReadOnlyList<IChartDefinition> All = new IChartDefinition[]
    {
        new HeadlinePathFigure(),
        new OutputCurveFigure(),
        new OpposingForcesFigure(),
        new ReformPathFigure(),
        new TornadoFigure(),
        new HeatmapFigure(),
        new DistributionFigure(),
    };

    /// <summary>
    /// The options' styles for a brief: scenario order with the baseline last, from the theme's palette when it sets
    /// one.
    /// </summary>
    public static OptionStyles Styles(SolvedScenario solved, IReadOnlyList<string>? chartColours) =>
        new(solved.Scenario.Inputs.Options.Select(o => o.Id), OptionStyles.FromHex(chartColours),
            solved.Scenario.Inputs.BaselineId);

    public static IReadOnlyList<ChartSpec> Build(ChartContext context)
        => All.SelectMany(d => d.Build(context)).ToList();
}
