using System.Collections.Concurrent;
using System.Runtime.CompilerServices;
using Briefwright.Model.Inputs;

namespace Briefwright.Model.Numerics;

/// <summary>
/// Integrals ∫ K(a)·e^(λa)·(c₀ + c₁a) da over ages by exactly the composite Gauss–Legendre rules of
/// <see cref="Quadrature"/>, with the kernel K sampled once at the nodes of every whole-year panel. On such a panel
/// e^(λ·node) is a fixed factor per node offset times a running product over panels, so further integrals with the
/// same kernel and another λ (Monte Carlo draws, optimum searches, cohort tables) cost multiplications instead of
/// exponentials. Panels cut short by the limits or by a breakpoint are evaluated directly.
/// </summary>
public sealed class TiltedKernel
{
    /// <summary>
    /// Above this |exponent| the caller integrates its own integrand instead (no overflow in e^(λa)).
    /// </summary>
    public const double MaxExponent = 600;

    private readonly Func<double, double> kernel;
    private readonly int panels;
    private readonly double[] k3, k5, whole;

    public TiltedKernel(Func<double, double> kernel, double maxAge)
    {
        this.kernel = kernel;
        panels = (int)Math.Ceiling(Math.Clamp(maxAge, 0, 1000));
        k3 = Sample(Quadrature.Nodes3);
        k5 = Sample(Quadrature.Nodes5);
        whole = new double[panels + 1];
        for (int j = 0; j <= panels; j++) whole[j] = kernel(j);
    }

    private double[] Sample(double[] nodes)
    {
        var k = new double[panels * nodes.Length];
        for (int j = 0; j < panels; j++)
            for (int i = 0; i < nodes.Length; i++)
                k[j * nodes.Length + i] = kernel(j + 0.5 + 0.5 * nodes[i]);
        return k;
    }

    /// <summary>Whether e^(λa) stays finite and accurate up to age <paramref name="upTo"/>.</summary>
    public static bool Safe(double lambda, double upTo) => Math.Abs(lambda) * (Math.Abs(upTo) + 1) < MaxExponent;

    /// <summary>
    /// ∫_a^b K(x)·e^(λx)·(c₀ + c₁x) dx with panels ending at whole years and at <paramref name="breakpoints"/>.
    /// </summary>
    public double Integrate(
        double a, double b, double lambda, IReadOnlyList<double>? breakpoints, bool fast, double c0 = 1, double c1 = 0)
    {
        if (!(b > a)) return 0.0;
        var tilt = new Tilt(this, lambda, fast, c0, c1);
        ReadOnlySpan<double> cuts = Cuts(breakpoints);
        double sum = 0.0, left = a;
        int bp = 0;
        while (left < b)
        {
            double right = Math.Min(b, Math.Floor(left) + 1.0);
            while (bp < cuts.Length && cuts[bp] <= left) bp++;
            if (bp < cuts.Length && cuts[bp] < right) right = cuts[bp];
            sum += tilt.Panel(left, right);
            left = right;
        }
        return sum;
    }

    /// <summary>
    /// The pieces of a cumulative table with a knot every year from <paramref name="a"/>: piece i is the integral over
    /// [a + i − 1, min(b, a + i)], split at breakpoints inside it, written to <paramref name="pieces"/>[1..]; and the
    /// integrand K(x)·e^(λx) at the knots x = min(b, a + i), written to <paramref name="knots"/>[0..].
    /// </summary>
    public void YearlyPieces(
        double a, double b, double lambda, IReadOnlyList<double>? breakpoints, bool fast, Span<double> pieces,
        Span<double> knots)
    {
        var tilt = new Tilt(this, lambda, fast, 1, 0);
        ReadOnlySpan<double> cuts = Cuts(breakpoints);
        double step = Math.Exp(lambda), carried = 0;
        int lastKnot = int.MinValue;
        for (int i = 0; i < knots.Length; i++)
        {
            double x = Math.Min(b, a + i);
            int j = (int)x;
            if (x == j && j >= 0 && j <= panels)
            {
                carried = j == lastKnot + 1 ? carried * step : Math.Exp(lambda * j);
                lastKnot = j;
                knots[i] = whole[j] * carried;
            }
            else knots[i] = kernel(x) * Math.Exp(lambda * x);
        }
        for (int i = 1; i < pieces.Length; i++)
        {
            double a0 = a + (i - 1), a1 = Math.Min(b, a + i);
            double sum = 0, left = a0;
            foreach (double x in cuts)
                {
                    if (x <= left) continue;
                    if (x >= a1) break;
                    sum += tilt.Panel(left, x);
                    left = x;
                }
            pieces[i] = sum + tilt.Panel(left, a1);
        }
    }

    /// <summary>
    /// Breakpoints as a span (survival curves hand out arrays; interface calls per panel cost more than the panel).
    /// </summary>
    private static ReadOnlySpan<double> Cuts(IReadOnlyList<double>? breakpoints) =>
        breakpoints is null ? default : breakpoints as double[] ?? breakpoints.ToArray();

    /// <summary>
    /// The state of one integral: node weights times e^(λ·offset) (with the polynomial factor folded in per node), and
    /// e^(λ·midpoint) carried from one whole-year panel to the next. A struct held in a local: integrals run thousands
    /// of times per Monte Carlo draw set, and this way they allocate nothing.
    /// </summary>
    private struct Tilt
    {
        private readonly TiltedKernel owner;
        private readonly double lambda, step, c0, c1;
        private readonly double[] nodes, weights, sampled;
        private readonly double f0, f1, f2, f3, f4;
        private readonly bool five;
        private double midFactor;
        private int lastPanel = int.MinValue;

        public Tilt(TiltedKernel owner, double lambda, bool fast, double c0, double c1)
        {
            this.owner = owner;
            this.lambda = lambda;
            this.c0 = c0;
            this.c1 = c1;
            five = !fast;
            nodes = fast ? Quadrature.Nodes3 : Quadrature.Nodes5;
            weights = fast ? Quadrature.Weights3 : Quadrature.Weights5;
            sampled = fast ? owner.k3 : owner.k5;
            double[] n = nodes, w = weights;
            double F(int i) => i < n.Length ? w[i] * Math.Exp(0.5 * lambda * n[i]) : 0;
            (f0, f1, f2, f3, f4) = (F(0), F(1), F(2), F(3), F(4));
            step = Math.Exp(lambda);
        }

        public double Panel(double left, double right)
        {
            int j = (int)left;
            if (left == j && right - left == 1.0 && j >= 0 && j < owner.panels)
            {
                midFactor = j == lastPanel + 1 ? midFactor * step : Math.Exp(lambda * (j + 0.5));
                lastPanel = j;
                double mid = j + 0.5, s;
                if (five)
                {
                    int o = 5 * j;
                    s = f0 * sampled[o] * (c0 + c1 * (mid + 0.5 * nodes[0]))
                        + f1 * sampled[o + 1] * (c0 + c1 * (mid + 0.5 * nodes[1]))
                        + f2 * sampled[o + 2] * (c0 + c1 * (mid + 0.5 * nodes[2]))
                        + f3 * sampled[o + 3] * (c0 + c1 * (mid + 0.5 * nodes[3]))
                        + f4 * sampled[o + 4] * (c0 + c1 * (mid + 0.5 * nodes[4]));
                }
                else
                {
                    int o = 3 * j;
                    s = f0 * sampled[o] * (c0 + c1 * (mid + 0.5 * nodes[0]))
                        + f1 * sampled[o + 1] * (c0 + c1 * (mid + 0.5 * nodes[1]))
                        + f2 * sampled[o + 2] * (c0 + c1 * (mid + 0.5 * nodes[2]));
                }
                return 0.5 * midFactor * s;
            }
            double half = 0.5 * (right - left), center = 0.5 * (left + right), direct = 0;
            for (int i = 0; i < nodes.Length; i++)
            {
                double x = center + half * nodes[i];
                direct += weights[i] * owner.kernel(x) * Math.Exp(lambda * x) * (c0 + c1 * x);
            }
            return half * direct;
        }
    }

    /// <summary>Kernels kept per survival curve (the table itself lets a curve and its kernels go with it).</summary>
    internal const int MaxKernelsPerCurve = 16;

    private static readonly ConditionalWeakTable<Survival, ConcurrentDictionary<double, TiltedKernel>> Cache = new();

    /// <summary>
    /// The kernel l(a)·e^(−β₂a²) of a survival curve and an experience curvature β₂ (0 without experience), built
    /// once per survival object and reused by every draw, option and search that shares it; null when e^(−β₂a²)
    /// would leave the range of doubles (the caller then integrates directly).
    /// </summary>
    public static TiltedKernel? For(Survival survival, double quadratic)
    {
        if (!(Math.Abs(quadratic) * survival.MaxAge * survival.MaxAge < MaxExponent)) return null;
        // Look-ups without locks or allocation once built: a draw asks for the same kernels many times.
        if (Cache.TryGetValue(survival, out var known) && known.TryGetValue(quadratic, out var kernel)) return kernel;
        var byQuadratic = Cache.GetValue(survival, _ => new());
        // Bounded: one survival curve meets few curvatures (one per scenario); should a caller vary it, the kernels
        // are rebuilt rather than kept without end (the same kernel is built the same way).
        if (byQuadratic.Count >= MaxKernelsPerCurve) byQuadratic.Clear();
        return byQuadratic.GetOrAdd(quadratic,
            q => new TiltedKernel(q == 0 ? survival.At : a => survival.At(a) * Math.Exp(-q * a * a), survival.MaxAge));
    }

    /// <summary>
    /// e^(−na)·l(a)·e^(β₁x − β₂x²) with x = a − s, as C·K(a)·e^(λa): the kernel, λ = β₁ + 2β₂s − n and log C = −β₁s −
    /// β₂s². Null when that form could overflow before <paramref name="upTo"/>.
    /// </summary>
    public static (TiltedKernel Kernel, double Lambda, double LogScale)? ForCohort(
        Demography d, ExperienceProfile? e, double s, double upTo)
    {
        double b1 = e?.Linear ?? 0, b2 = e?.Quadratic ?? 0;
        double lambda = b1 + 2 * b2 * s - d.GrowthRate, logScale = -b1 * s - b2 * s * s;
        if (!Safe(lambda, upTo) || !(Math.Abs(logScale) < MaxExponent) || For(d.Survival, b2) is not { } kernel)
            return null;
        return (kernel, lambda, logScale);
    }
}
