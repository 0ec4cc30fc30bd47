using Briefwright.Model.Inputs;
using Briefwright.Model.Numerics;

namespace Briefwright.Model.Dynamics;

/// <summary>
/// Effective labour of the cohorts with one schooling length E, as a cumulative integral over age:
/// F(a) = ∫_{a₀+E}^{a} e^(−nu) l(u) e^(m(u − a₀ − E)) du, tabulated every <see cref="Step"/> years with exact
/// Gauss–Legendre panels and read back by cubic Hermite interpolation (F' is known exactly).
/// </summary>
internal sealed class CohortLabour
{
    public const double Step = 1.0;
    private readonly double start, end, lnH, n;
    private readonly double[] values, slopes;
    private readonly Demography d;
    private readonly ExperienceProfile? experience;

    public CohortLabour(Demography d, HumanCapital hc, double schooling, double lastWorkingAge)
    {
        this.d = d;
        experience = hc.Experience;
        n = d.GrowthRate;
        start = d.EntryAge + schooling;
        end = Math.Min(lastWorkingAge, d.Survival.MaxAge);
        lnH = hc.Returns.Phi(schooling);
        SchoolingCapital = Math.Exp(lnH);
        int count = end > start ? (int)Math.Ceiling((end - start) / Step) + 1 : 1;
        values = new double[count];
        slopes = new double[count];
        if (TiltedKernel.ForCohort(d, experience, start, end) is { } t)
        {
            t.Kernel.YearlyPieces(start, end, t.Lambda, d.Survival.Breakpoints, fast: true, values, slopes);
            double scale = Math.Exp(t.LogScale);
            slopes[0] *= scale;
            for (int i = 1; i < count; i++)
            {
                values[i] = values[i - 1] + scale * values[i];
                slopes[i] *= scale;
            }
            return;
        }
        slopes[0] = Integrand(start);
        for (int i = 1; i < count; i++)
        {
            double a0 = start + (i - 1) * Step, a1 = Math.Min(end, start + i * Step);
            values[i] = values[i - 1] + PanelIntegral(a0, a1);
            slopes[i] = Integrand(a1);
        }
    }

    /// <summary>One table step, split at life-table ages so that each piece is smooth.</summary>
    private double PanelIntegral(double a0, double a1)
    {
        double sum = 0, left = a0;
        foreach (double b in d.Survival.Breakpoints)
        {
            if (b <= left) continue;
            if (b >= a1) break;
            sum += Quadrature.Panel3(Integrand, left, b);
            left = b;
        }
        return sum + Quadrature.Panel3(Integrand, left, a1);
    }

    /// <summary>log h(E) from schooling alone; the experience premium is inside the integral.</summary>
    public double LogSchoolingCapital => lnH;

    /// <summary>e^φ(E), the schooling part of human capital.</summary>
    public double SchoolingCapital { get; private init; } = double.NaN;

    private double Integrand(double a) =>
        Math.Exp(-n * a) * d.Survival.At(a) * (experience is { } e ? Math.Exp(e.LogPremium(a - start)) : 1.0);

    /// <summary>
    /// ∫ over working ages between <paramref name="from"/> and <paramref name="to"/> (clamped to [a₀+E, last working
    /// age]).
    /// </summary>
    public double Between(double from, double to)
    {
        from = Math.Max(from, start);
        to = Math.Min(to, end);
        return to > from ? At(to) - At(from) : 0.0;
    }

    private double At(double a)
    {
        if (a <= start) return 0.0;
        double pos = (a - start) / Step;
        int i = (int)pos;
        if (i >= values.Length - 1) return values[^1];
        double x0 = start + i * Step, x1 = Math.Min(end, x0 + Step), h = x1 - x0;
        double t = (a - x0) / h, t2 = t * t, t3 = t2 * t;
        return (2 * t3 - 3 * t2 + 1) * values[i] + (t3 - 2 * t2 + t) * h * slopes[i]
             + (-2 * t3 + 3 * t2) * values[i + 1] + (t3 - t2) * h * slopes[i + 1];
    }
}
