namespace Briefwright.Model.Uncertainty;

/// <summary>The standard normal CDF, density and quantile.</summary>
public static class NormalQuantile
{
    public static double Pdf(double z) => Math.Exp(-0.5 * z * z) / Math.Sqrt(2 * Math.PI);

    public static double Cdf(double z) => 0.5 * MathNet.Numerics.SpecialFunctions.Erfc(-z / Math.Sqrt(2));

    /// <summary>Φ⁻¹(p), from Math.NET's inverse error function.</summary>
    public static double Standard(double p) => -Math.Sqrt(2) * MathNet.Numerics.SpecialFunctions.ErfcInv(2 * p);
}
