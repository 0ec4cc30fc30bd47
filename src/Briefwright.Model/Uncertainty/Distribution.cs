namespace Briefwright.Model.Uncertainty;

/// <summary>
/// A parameter distribution, sampled by its inverse CDF so that Monte Carlo and Sobol sampling share one route.
/// </summary>
public abstract record Distribution
{
    /// <summary>The value whose cumulative probability is <paramref name="u"/> (0 &lt; u &lt; 1).</summary>
    public abstract double Quantile(double u);

    public abstract double Mean { get; }

    public abstract string Describe(Func<double, string> format);
}

public sealed record NormalDistribution(double Mu, double Sigma) : Distribution
{
    public override double Quantile(double u) => Mu + Sigma * NormalQuantile.Standard(u);
    public override double Mean => Mu;
    public override string Describe(Func<double, string> f) => $"normal, mean {f(Mu)}, s.d. {f(Sigma)}";
}

/// <summary>
/// A normal truncated to [Low, High]: the quantile is taken within the normal's probability mass of that interval.
/// </summary>
public sealed record TruncatedNormalDistribution(double Mu, double Sigma, double Low, double High) : Distribution
{
    private double PLow => NormalQuantile.Cdf((Low - Mu) / Sigma);
    private double PHigh => NormalQuantile.Cdf((High - Mu) / Sigma);

    public override double Quantile(double u)
    {
        double p = PLow + u * (PHigh - PLow);
        return Math.Clamp(Mu + Sigma * NormalQuantile.Standard(Math.Clamp(p, 1e-300, 1 - 1e-16)), Low, High);
    }

    public override double Mean
    {
        get
        {
            double a = (Low - Mu) / Sigma, b = (High - Mu) / Sigma;
            return Mu + Sigma * (NormalQuantile.Pdf(a) - NormalQuantile.Pdf(b)) / (PHigh - PLow);
        }
    }

    public override string Describe(Func<double, string> f) =>
        $"truncated normal, mean {f(Mu)}, s.d. {f(Sigma)}, within {f(Low)} to {f(High)}";
}

public sealed record UniformDistribution(double Low, double High) : Distribution
{
    public override double Quantile(double u) => Low + u * (High - Low);
    public override double Mean => (Low + High) / 2;
    public override string Describe(Func<double, string> f) => $"uniform, {f(Low)} to {f(High)}";
}

public sealed record TriangularDistribution(double Low, double Mode, double High) : Distribution
{
    public override double Quantile(double u)
    {
        double c = (Mode - Low) / (High - Low);
        return u < c
            ? Low + Math.Sqrt(u * (High - Low) * (Mode - Low))
            : High - Math.Sqrt((1 - u) * (High - Low) * (High - Mode));
    }

    public override double Mean => (Low + Mode + High) / 3;
    public override string Describe(Func<double, string> f) =>
        $"triangular, {f(Low)} to {f(High)}, most likely {f(Mode)}";
}

/// <summary>ln X ~ N(ln Median, SigmaLog²).</summary>
public sealed record LognormalDistribution(double Median, double SigmaLog) : Distribution
{
    public override double Quantile(double u) => Median * Math.Exp(SigmaLog * NormalQuantile.Standard(u));
    public override double Mean => Median * Math.Exp(SigmaLog * SigmaLog / 2);
    public override string Describe(Func<double, string> f) =>
        $"lognormal, median {f(Median)}, s.d. of log {SigmaLog:0.###}";
}
