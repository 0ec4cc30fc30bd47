namespace Briefwright.Model.Numerics;

/// <summary>Elementary functions that System.Math lacks, accurate near zero.</summary>
public static class Stable
{
    /// <summary>e^x − 1 without cancellation for small x.</summary>
    public static double Expm1(double x) =>
        Math.Abs(x) < 1e-5 ? x + x * x / 2 + x * x * x / 6 : Math.Exp(x) - 1.0;

    /// <summary>(e^x − 1)/x, equal to 1 at x = 0.</summary>
    public static double RelativeExpm1(double x) =>
        Math.Abs(x) < 1e-5 ? 1 + x / 2 + x * x / 6 : (Math.Exp(x) - 1.0) / x;

    /// <summary>ln(1 + x) without cancellation for small x.</summary>
    public static double Log1p(double x)
    {
        double u = 1.0 + x;
        return u == 1.0 ? x : Math.Log(u) * x / (u - 1.0);
    }
}
