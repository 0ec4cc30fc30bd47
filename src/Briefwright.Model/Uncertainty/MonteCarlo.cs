using Briefwright.Model.Inputs;

namespace Briefwright.Model.Uncertainty;

/// <summary>
/// Percentiles 5, 25, 50, 75, 95 and the mean of one result over the accepted draws (the fan chart's data; summaries
/// add their precision, <see cref="PercentileSummary"/>).
/// </summary>
public sealed record Percentiles(double P5, double P25, double P50, double P75, double P95, double Mean)
{
    /// <summary>
    /// The percentiles of <paramref name="sorted"/>, which is sorted in place (callers pass an array of their own).
    /// </summary>
    public static Percentiles Of(double[] sorted)
    {
        Array.Sort(sorted);
        double Q(double p)
        {
            // Linear interpolation between order statistics (type 7, the common default).
            double h = (sorted.Length - 1) * p;
            int i = (int)Math.Floor(h);
            return i + 1 < sorted.Length ? sorted[i] + (h - i) * (sorted[i + 1] - sorted[i]) : sorted[i];
        }
        return new Percentiles(Q(0.05), Q(0.25), Q(0.5), Q(0.75), Q(0.95), sorted.Average());
    }
}

/// <summary>
/// One option's Monte Carlo results: the long-run change (percent) and the present value to the horizon (years of
/// output per person at the valuation date), and the probabilities of a gain and of a positive present value.
/// </summary>
public sealed record OptionUncertainty(
    string OptionId, PercentileSummary LongRunChangePct, PercentileSummary PresentValue, Probability ProbabilityGain,
    Probability ProbabilityPositivePv);

/// <summary>
/// Monte Carlo results: distributions of the key results, probabilities, and a fan of the headline path.
/// </summary>
public sealed record MonteCarloResults(
    int Draws,
    int Rejected,
    ulong Seed,
    IReadOnlyList<OptionUncertainty> Options,
    PercentileSummary OptimumYears,
    IReadOnlyList<Percentiles> HeadlineFan,
    double[] HeadlineChangeSample)
{
    public bool Equals(MonteCarloResults? other) =>
        other is not null && Draws == other.Draws && Rejected == other.Rejected && Seed == other.Seed
        && Same.Items(Options, other.Options) && OptimumYears.Equals(other.OptimumYears)
        && Same.Items(HeadlineFan, other.HeadlineFan) && Same.Items(HeadlineChangeSample, other.HeadlineChangeSample);

    public override int GetHashCode() =>
        HashCode.Combine(Draws, Rejected, Seed, Same.Hash(Options), Same.Hash(HeadlineChangeSample));
}

public static class MonteCarlo
{
    public const int MaxAttemptsPerDraw = 20;

    /// <summary>Maps uniforms in (0,1) to parameter values through each distribution's quantile function.</summary>
    public static ModelInputs Apply(
        ModelInputs inputs, IReadOnlyList<UncertainParameter> parameters, ReadOnlySpan<double> u)
    {
        for (int j = 0; j < parameters.Count; j++)
            inputs = Parameters.Find(parameters[j].Parameter)!.Set(inputs, parameters[j].Distribution.Quantile(u[j]));
        return inputs;
    }

    /// <summary>
    /// Draw i uses its own random stream from (seed, i), so results are identical however the draws are spread
    /// over threads. A draw whose inputs break a model rule is rejected, counted and replaced by the next attempt of
    /// the same stream.
    /// </summary>
    public static MonteCarloResults Run(
        ModelInputs inputs, AnalysisSettings settings, double optimumGuess, int maxThreads = ModelThreads.AllCores)
    {
        var spec = settings.MonteCarlo ?? throw new ArgumentException("No Monte Carlo settings.");
        int d = spec.Parameters.Count;
        var results = new KeyResults?[spec.Draws];
        var rejected = new int[spec.Draws];
        // The headline paths of all draws, row by row, in one block allocated once: kept as an array per draw they
        // would be copied by every collection while the draws run.
        int width = settings.Reform.HorizonYears + 1;
        var paths = new double[spec.Draws * width];
        Parallel.For(0, spec.Draws, ModelThreads.Options(maxThreads), i =>
        {
            var rng = SplitMix64.ForStream(spec.Seed, (ulong)i);
            Span<double> u = stackalloc double[d];
            for (int attempt = 0; attempt < MaxAttemptsPerDraw; attempt++)
            {
                for (int j = 0; j < d; j++) u[j] = rng.NextOpenUnit();
                var trial = Apply(inputs, spec.Parameters, u);
                if (Parameters.Violation(trial) is not null) { rejected[i]++; continue; }
                results[i] = KeyResultsEvaluator.Evaluate(
                    trial, settings, optimumGuess, headlinePath: paths.AsSpan(i * width, width));
                return;
            }
        });
        var acceptedDraws = Enumerable.Range(0, spec.Draws).Where(i => results[i] is not null).ToArray();
        var accepted = acceptedDraws.Select(i => results[i]!).ToList();
        if (accepted.Count < spec.Draws / 2)
            throw new ModelRuleException($"Monte Carlo: {rejected.Sum()} draws broke a model rule and only " +
                $"{accepted.Count} of {spec.Draws} were accepted; narrow the distributions.");
        var ids = accepted[0].OptionIds;
        var options = ids.Select((id, k) => new OptionUncertainty(
            id,
            PercentileSummary.Of(accepted.Select(r => r.LongRunChangePct[k]).ToArray()),
            PercentileSummary.Of(accepted.Select(r => r.PresentValue[k]).ToArray()),
            Probability.Of(accepted.Count(r => r.LongRunChangePct[k] > 0), accepted.Count),
            Probability.Of(accepted.Count(r => r.PresentValue[k] > 0), accepted.Count))).ToList();
        var fan = ModelThreads.Map(width, maxThreads, t =>
        {
            var atT = new double[acceptedDraws.Length];
            for (int j = 0; j < atT.Length; j++) atT[j] = paths[acceptedDraws[j] * width + t];
            return Percentiles.Of(atT);
        });
        int headline = ids.ToList().IndexOf(settings.HeadlineOptionId);
        return new MonteCarloResults(accepted.Count, rejected.Sum(), spec.Seed, options,
            PercentileSummary.Of(accepted.Select(r => r.OptimumYears).ToArray()), fan,
            accepted.Select(r => r.LongRunChangePct[headline]).ToArray());
    }
}
