using Briefwright.Model.Inputs;

namespace Briefwright.Model.Uncertainty;

/// <summary>
/// Effect of one parameter at the low and high end of its range on every key result (one row of a tornado).
/// </summary>
public sealed record TornadoRow(
    string Parameter, string Label, double Low, double High, KeyResults AtLow, KeyResults AtHigh, double Swing);

/// <summary>A two-way grid: <see cref="Values"/>[i][j] at X[i], Y[j].</summary>
/// <summary>Cells whose inputs break a model rule are null.</summary>
public sealed record GridResult(GridSpec Spec, double[] X, double[] Y, double?[][] Values, int Invalid)
{
    public bool Equals(GridResult? other) =>
        other is not null && Spec.Equals(other.Spec) && Same.Items(X, other.X) && Same.Items(Y, other.Y)
        && Same.Items(Values, other.Values, (a, b) => Same.Items(a, b)) && Invalid == other.Invalid;

    public override int GetHashCode() => HashCode.Combine(Spec, Same.Hash(X), Same.Hash(Y), Invalid);
}

public static class Sensitivity
{
    /// <summary>
    /// One-at-a-time ranges, sorted by the swing in the headline option's long-run change (largest first).
    /// </summary>
    public static IReadOnlyList<TornadoRow> Tornado(
        ModelInputs inputs, AnalysisSettings settings, double optimumGuess, int maxThreads = ModelThreads.AllCores)
    {
        int headline = inputs.Options.Where(o => o.Id != inputs.BaselineId).Select(o => o.Id).ToList()
            .IndexOf(settings.HeadlineOptionId);
        var rows = ModelThreads.Map(settings.Ranges.Count, maxThreads, r =>
        {
            var range = settings.Ranges[r];
            var def = Parameters.Find(range.Parameter)
                ?? throw new ArgumentException($"Unknown parameter {range.Parameter}.");
            var low = KeyResultsEvaluator.Evaluate(def.Set(inputs, range.Low), settings, optimumGuess);
            var high = KeyResultsEvaluator.Evaluate(def.Set(inputs, range.High), settings, optimumGuess);
            return new TornadoRow(
                range.Parameter, def.Label, range.Low, range.High, low, high,
                Math.Abs(high.LongRunChangePct[headline] - low.LongRunChangePct[headline]));
        });
        // Swings equal to rounding (parameters that do not move the long-run change) tie and are ordered by name, so
        // the order does not flip on a last-digit difference.
        return rows.OrderByDescending(r => Math.Round(r.Swing, 9))
            .ThenBy(r => r.Parameter, StringComparer.Ordinal).ToList();
    }

    public static GridResult Grid(
        ModelInputs inputs, AnalysisSettings settings, GridSpec spec, double optimumGuess,
        int maxThreads = ModelThreads.AllCores)
    {
        var dx = Parameters.Find(spec.X)!;
        var dy = Parameters.Find(spec.Y)!;
        double[] Axis(double lo, double hi) =>
            Enumerable.Range(0, spec.Steps).Select(i => lo + (hi - lo) * i / (spec.Steps - 1)).ToArray();
        var xs = Axis(spec.XLow, spec.XHigh);
        var ys = Axis(spec.YLow, spec.YHigh);
        int invalid = 0;
        var values = ModelThreads.Map(xs.Length, maxThreads, i => ys.Select(double? (y) =>
        {
            var trial = dy.Set(dx.Set(inputs, xs[i]), y);
            if (Parameters.Violation(trial) is not null) { Interlocked.Increment(ref invalid); return null; }
            if (spec.Output == "optimum")
                return Core.OptimumSearch.LocalFrom(
                    trial.DemographyFor(trial.Baseline), trial.HumanCapital, optimumGuess);
            double baseY = Core.BalancedGrowth.OutputPerPerson(trial, trial.Baseline);
            return 100 * (Core.BalancedGrowth.OutputPerPerson(
                trial, trial.Options.First(o => o.Id == settings.HeadlineOptionId)) / baseY - 1);
        }).ToArray());
        return new GridResult(spec, xs, ys, values, invalid);
    }
}
