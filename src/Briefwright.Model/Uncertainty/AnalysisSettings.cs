using Briefwright.Model.Dynamics;

namespace Briefwright.Model.Uncertainty;

/// <summary>One-at-a-time range for a parameter (data behind a tornado chart).</summary>
public sealed record SensitivityRange(string Parameter, double Low, double High);

/// <summary>
/// A two-way grid over two parameters; <see cref="Output"/> is "optimum" (E*) or "change" (headline option's long-run
/// change).
/// </summary>
public sealed record GridSpec(
    string X, double XLow, double XHigh, string Y, double YLow, double YHigh, int Steps, string Output);

public sealed record UncertainParameter(string Parameter, Distribution Distribution);

/// <summary>
/// Monte Carlo and Sobol settings: draws and seed come from the scenario, so a brief is reproducible.
/// </summary>
public sealed record MonteCarloSpec(
    int Draws, ulong Seed, IReadOnlyList<UncertainParameter> Parameters, int SobolSamples);

/// <summary>Everything beyond the balanced growth path that a scenario asks for.</summary>
public sealed record AnalysisSettings(
    ReformSettings Reform,
    string HeadlineOptionId,
    IReadOnlyList<DiscountSchedule> Discounts,
    IReadOnlyList<SensitivityRange> Ranges,
    IReadOnlyList<GridSpec> Grids,
    MonteCarloSpec? MonteCarlo)
{
    /// <summary>The schedule used for headline present values and the discounted optimum (the first one).</summary>
    public DiscountSchedule Headline => Discounts[0];
}
