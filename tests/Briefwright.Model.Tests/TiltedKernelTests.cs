using Briefwright.Model.Inputs;
using Briefwright.Model.Numerics;

namespace Briefwright.Model.Tests;

/// <summary>
/// The cached-kernel integrals must be the same Gauss–Legendre sums as integrating the full integrand directly,
/// up to rounding, and exact where the rule is exact.
/// </summary>
public class TiltedKernelTests
{
    private static readonly Survival Gompertz = new GompertzMakehamSurvival(0.0004, 3.0e-6, 1.12, 110);

    private static readonly Survival LifeTable = new TabulatedSurvival(
        new double[] { 0, 1, 5, 10, 20, 30, 40, 50, 60, 70, 80, 90, 100 },
        new double[] { 1, 0.995, 0.994, 0.993, 0.99, 0.985, 0.975, 0.95, 0.9, 0.78, 0.55, 0.2, 0 });

    public static TheoryData<int> Seeds => new() { 1, 2, 3, 4, 5, 6, 7, 8 };

    [Theory]
    [MemberData(nameof(Seeds))]
    public void Matches_direct_quadrature_of_the_whole_integrand(int seed)
    {
        var rng = new Random(seed);
        foreach (var survival in new[] { Gompertz, LifeTable })
        foreach (bool fast in new[] { false, true })
        {
            double b2 = rng.NextDouble() * 0.001, lambda = -0.03 + rng.NextDouble() * 0.12;
            double c0 = rng.NextDouble(), c1 = -0.01 * rng.NextDouble();
            // Whole-year and fractional limits, so both the cached and the direct panels are exercised.
            double lo = rng.Next(0, 30) + (rng.Next(2) == 0
                ? 0
                : rng.NextDouble()), hi = lo + 10 + rng.NextDouble() * 60;
            var kernel = TiltedKernel.For(survival, b2)!;
            double tilted = kernel.Integrate(lo, hi, lambda, survival.Breakpoints, fast, c0, c1);
            double direct = Quadrature.Integrate(
                a => survival.At(a) * Math.Exp(-b2 * a * a + lambda * a) * (c0 + c1 * a),
                lo,
                hi,
                survival.Breakpoints,
                fast);
            // Relative to the integral of |f|: c₀ + c₁a may change sign, and then the sum itself can be small.
            double size = Quadrature.Integrate(
                a => Math.Abs(survival.At(a) * Math.Exp(-b2 * a * a + lambda * a) * (c0 + c1 * a)),
                lo,
                hi,
                survival.Breakpoints,
                fast);
            Assert.Equal(direct, tilted, size * 1e-12);
        }
    }

    [Fact]
    public void Is_exact_for_an_exponential_under_rectangular_survival()
    {
        // ∫_2^40 e^(0.05a) da = (e^2 − e^0.1)/0.05, a worked closed form; five-point Gauss–Legendre on one-year
        // panels is accurate to far better than 1e-12 for this integrand.
        var kernel = TiltedKernel.For(new RectangularSurvival(80), 0)!;
        double exact = (Math.Exp(2.0) - Math.Exp(0.1)) / 0.05;
        Assert.Equal(exact, kernel.Integrate(2, 40, 0.05, null, fast: false), exact * 1e-12);
    }

    [Fact]
    public void Yearly_pieces_sum_to_the_whole_integral()
    {
        var kernel = TiltedKernel.For(LifeTable, 0.0007)!;
        var pieces = new double[52];
        var knots = new double[52];
        kernel.YearlyPieces(17, 67.5, 0.06, LifeTable.Breakpoints, fast: true, pieces, knots);
        double whole = kernel.Integrate(17, 67.5, 0.06, LifeTable.Breakpoints, fast: true);
        Assert.Equal(0, pieces[0]);
        Assert.Equal(whole, pieces.Sum(), whole * 1e-13);
        // The integrand at the knots 17, 18, …, 67, 67.5, against direct evaluation.
        for (int i = 0; i < knots.Length; i++)
        {
            double x = Math.Min(67.5, 17 + i), direct = LifeTable.At(x) * Math.Exp(-0.0007 * x * x + 0.06 * x);
            Assert.Equal(direct, knots[i], direct * 1e-12);
        }
    }

    [Fact]
    public void Declines_a_curvature_that_would_overflow()
    {
        Assert.Null(TiltedKernel.For(Gompertz, -0.5));
        Assert.False(TiltedKernel.Safe(7, 110));
    }
}
