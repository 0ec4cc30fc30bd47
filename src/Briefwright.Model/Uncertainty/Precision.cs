namespace Briefwright.Model.Uncertainty;

/// <summary>A confidence interval [Low, High].</summary>
public sealed record Interval(double Low, double High);

/// <summary>
/// A probability estimated from Monte Carlo draws: <see cref="Count"/> of <see cref="Draws"/>, with the Wilson score
/// interval at 95% (Wilson 1927; recommended over the normal-approximation interval by Agresti &amp; Coull 1998 and
/// Newcombe 1998), which stays inside [0, 1] and is not empty when every draw or none shows the event.
/// </summary>
public sealed record Probability(double Estimate, int Count, int Draws, double Low, double High)
{
    public static Probability Of(int count, int draws)
    {
        var (low, high) = Precision.Wilson(count, draws, Precision.Z95);
        return new Probability((double)count / draws, count, draws, low, high);
    }
}

/// <summary>
/// Percentiles 5, 25, 50, 75, 95 and the mean of one result over the accepted draws, each with its Monte Carlo
/// precision: a 95% distribution-free interval for each percentile from order statistics, and the mean's standard
/// error.
/// </summary>
public sealed record PercentileSummary(
    double P5, double P25, double P50, double P75, double P95, double Mean, double MeanStandardError,
    Interval P5Interval, Interval P25Interval, Interval P50Interval, Interval P75Interval, Interval P95Interval)
{
    /// <summary>
    /// The summary of <paramref name="sample"/>, which is sorted in place (callers pass an array of their own).
    /// </summary>
    public static PercentileSummary Of(double[] sample)
    {
        var p = Percentiles.Of(sample);
        double sd = Precision.StandardDeviation(sample, p.Mean);
        Interval I(double q) => Precision.QuantileInterval(sample, q, Precision.Z95);
        return new PercentileSummary(p.P5, p.P25, p.P50, p.P75, p.P95, p.Mean, sd / Math.Sqrt(sample.Length),
            I(0.05), I(0.25), I(0.5), I(0.75), I(0.95));
    }
}

public static class Precision
{
    /// <summary>Φ⁻¹(0.975), the two-sided 95% normal quantile.</summary>
    public static readonly double Z95 = NormalQuantile.Standard(0.975);

    /// <summary>Wilson score interval for <paramref name="count"/> successes in <paramref name="n"/> trials.</summary>
    public static (double Low, double High) Wilson(int count, int n, double z)
    {
        if (n <= 0) throw new ArgumentOutOfRangeException(nameof(n), n, "Needs at least one trial.");
        double p = (double)count / n, z2 = z * z;
        double centre = (p + z2 / (2.0 * n)) / (1 + z2 / n);
        double half = z * Math.Sqrt(p * (1 - p) / n + z2 / (4.0 * n * n)) / (1 + z2 / n);
        // At 0 or n successes one end is exactly 0 or 1; computed it may miss by a rounding error.
        return (count == 0 ? 0 : Math.Max(0, centre - half), count == n ? 1 : Math.Min(1, centre + half));
    }

    /// <summary>
    /// Distribution-free interval for the q-quantile of a sorted sample: order statistics of ranks
    /// n·q ∓ z·√(n·q·(1 − q)), rounded outwards (large-sample binomial approximation; Conover 1999, Practical
    /// Nonparametric Statistics, §3.2), clamped to the sample.
    /// </summary>
    public static Interval QuantileInterval(double[] sorted, double q, double z)
    {
        int n = sorted.Length;
        double centre = n * q, spread = z * Math.Sqrt(n * q * (1 - q));
        int lowRank = Math.Clamp((int)Math.Floor(centre - spread), 1, n);
        int highRank = Math.Clamp((int)Math.Ceiling(centre + spread) + 1, 1, n);
        return new Interval(sorted[lowRank - 1], sorted[highRank - 1]);
    }

    public static double StandardDeviation(double[] sample, double mean)
    {
        if (sample.Length < 2) return 0;
        double s = 0;
        foreach (double v in sample) s += (v - mean) * (v - mean);
        return Math.Sqrt(s / (sample.Length - 1));
    }
}
