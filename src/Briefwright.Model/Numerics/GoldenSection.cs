namespace Briefwright.Model.Numerics;

/// <summary>Golden-section search for the maximum of a unimodal function (Kiefer 1953; as in Press et al.,
/// Numerical Recipes, 3rd ed., §10.2): each step keeps the better interior point and shrinks the bracket by
/// (√5 − 1)/2, reusing one function value.</summary>
public static class GoldenSection
{
    /// <summary>The final bracket [Lo, Hi] around the maximum of <paramref name="f"/> on [lo, hi], stopping once it is
    /// no wider than <paramref name="tolerance"/> or after <paramref name="maxIterations"/> steps.</summary>
    public static (double Lo, double Hi, int Iterations) Maximise(
        Func<double, double> f, double lo, double hi, double tolerance, int maxIterations = 200)
    {
        double phi = (Math.Sqrt(5) - 1) / 2;
        double x1 = hi - phi * (hi - lo), x2 = lo + phi * (hi - lo);
        double f1 = f(x1), f2 = f(x2);
        int it = 0;
        while (hi - lo > tolerance && it < maxIterations)
        {
            if (f1 < f2) { lo = x1; x1 = x2; f1 = f2; x2 = lo + phi * (hi - lo); f2 = f(x2); }
            else { hi = x2; x2 = x1; f2 = f1; x1 = hi - phi * (hi - lo); f1 = f(x1); }
            it++;
        }
        return (lo, hi, it);
    }
}
