using Briefwright.Model.Dynamics;
using Briefwright.Model.Results;

namespace Briefwright.Model.Uncertainty;

/// <summary>One parameter's effect on one option's long-run change (percent), at the ends of its range (one tornado
/// bar).</summary>
public sealed record OptionSwing(TornadoRow Row, double AtLowPct, double AtHighPct);

/// <summary>
/// Everything computed for one option, together: its balanced-growth result, and for an alternative its reform path
/// and present values (<see cref="Appraisal"/>), its Monte Carlo summaries (<see cref="Uncertainty"/>, when drawn) and
/// the tornado's effect on its long-run change (<see cref="Swings"/>, in the tornado's order).
/// </summary>
public sealed record OptionOutcome(
    OptionResult BalancedGrowth,
    OptionAppraisal? Appraisal,
    OptionUncertainty? Uncertainty,
    IReadOnlyList<OptionSwing> Swings)
{
    public string Id => BalancedGrowth.Id;

    public bool IsBaseline => BalancedGrowth.IsBaseline;

    /// <summary>The reform path (alternatives only).</summary>
    public ReformPath Path =>
        Appraisal?.Path ?? throw new InvalidOperationException($"The baseline {Id} has no reform path.");

    /// <summary>Present values under every discount schedule, the headline schedule first (alternatives
    /// only).</summary>
    public IReadOnlyList<PresentValue> PresentValues => Appraisal?.PresentValues ?? [];

    public bool Equals(OptionOutcome? other) =>
        other is not null && BalancedGrowth.Equals(other.BalancedGrowth) && Equals(Appraisal, other.Appraisal)
        && Equals(Uncertainty, other.Uncertainty) && Same.Items(Swings, other.Swings);

    public override int GetHashCode() => HashCode.Combine(BalancedGrowth, Appraisal, Uncertainty, Same.Hash(Swings));
}

/// <summary>
/// The results shaped per option, in scenario order, with the headline option and the baseline at hand: the one place
/// that matches the model's lists (balanced growth, appraisal, Monte Carlo, tornado) by option id.
/// </summary>
public sealed class OptionOutcomes : IEquatable<OptionOutcomes>
{
    private OptionOutcomes(IReadOnlyList<OptionOutcome> all, string headlineId)
    {
        All = all;
        Headline = all.Single(o => o.Id == headlineId);
        Baseline = all.Single(o => o.IsBaseline);
        Alternatives = all.Where(o => !o.IsBaseline).ToList();
    }

    /// <summary>Every option in scenario order.</summary>
    public IReadOnlyList<OptionOutcome> All { get; }

    /// <summary>The option the brief headlines (fan chart, tornado, Sobol indices, page 1).</summary>
    public OptionOutcome Headline { get; }

    public OptionOutcome Baseline { get; }

    /// <summary>Every option but the baseline, in scenario order (the order of the appraisal and Monte Carlo
    /// lists).</summary>
    public IReadOnlyList<OptionOutcome> Alternatives { get; }

    public OptionOutcome this[string id] => All.First(o => o.Id == id);

    public static OptionOutcomes From(BalancedGrowthResults results, AnalysisResults analysis)
    {
        var appraisals = analysis.Reform.Options.ToDictionary(o => o.OptionId, StringComparer.Ordinal);
        var uncertainty = analysis.MonteCarlo?.Options.ToDictionary(o => o.OptionId, StringComparer.Ordinal);
        var all = results.Options.Select(o =>
        {
            var appraisal = appraisals.GetValueOrDefault(o.Id);
            IReadOnlyList<OptionSwing> swings = o.IsBaseline || appraisal is null ? [] : analysis.Tornado
                .Select(t => new OptionSwing(t, t.AtLow.LongRunChangeOf(o.Id), t.AtHigh.LongRunChangeOf(o.Id)))
                .ToList();
            return new OptionOutcome(o, appraisal, uncertainty?.GetValueOrDefault(o.Id), swings);
        }).ToList();
        return new OptionOutcomes(all, analysis.HeadlineOptionId);
    }

    public bool Equals(OptionOutcomes? other) =>
        other is not null && Headline.Id == other.Headline.Id && Same.Items(All, other.All);

    public override bool Equals(object? obj) => Equals(obj as OptionOutcomes);

    public override int GetHashCode() => HashCode.Combine(Headline.Id, Same.Hash(All));
}
