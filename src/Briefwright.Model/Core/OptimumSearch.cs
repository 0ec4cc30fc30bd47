using Briefwright.Model.Inputs;
using Briefwright.Model.Results;

namespace Briefwright.Model.Core;

/// <summary>
/// Output-maximising schooling length: closed form where it applies, otherwise a grid search over the
/// feasible range with every local maximum refined by bisection on the sign of d ln(h·ω)/dE.
/// </summary>
public static class OptimumSearch
{
    public const int DefaultGridPoints = 400;
    public const double Tolerance = 1e-10;

    public static OptimumResult Find(
        Demography demography, HumanCapital humanCapital, double outputPerEffectiveWorker,
        int gridPoints = DefaultGridPoints)
    {
        var cycle = new LifeCycle(demography, humanCapital);
        double eMax = cycle.MaxSchooling;
        var grid = new double[gridPoints + 1];
        for (int i = 0; i <= gridPoints; i++) grid[i] = cycle.Objective(eMax * i / gridPoints);

        var maxima = new List<LocalMaximum>();
        int iterations = 0;
        bool converged = true;
        var refinement = RefinementMethod.DerivativeBisection;
        if (grid[0] >= grid[1]) maxima.Add(new LocalMaximum(0.0, grid[0], AtBoundary: true));
        for (int i = 1; i < gridPoints; i++)
        {
            if (!(grid[i] >= grid[i - 1] && grid[i] > grid[i + 1])) continue;
            var (e, it, ok, how) = Refine(cycle, eMax * (i - 1) / gridPoints, eMax * (i + 1) / gridPoints);
            iterations += it;
            converged &= ok;
            if (how != refinement) refinement = how;
            maxima.Add(new LocalMaximum(e, cycle.Objective(e), AtBoundary: false));
        }
        if (maxima.Count == 0) maxima.Add(new LocalMaximum(eMax, grid[gridPoints], AtBoundary: true));

        var best = maxima.MaxBy(m => m.OutputPerPerson)!;
        double bestE = best.SchoolingYears;
        bool atBoundary = best.AtBoundary;
        var method = OptimumMethod.Numerical;
        var whyNot = WhyNotClosedForm(demography, humanCapital);
        if (whyNot is null)
        {
            bestE = ClosedForm(demography, ((ConstantReturn)humanCapital.Returns).Rate, eMax);
            atBoundary = bestE <= 0.0 || bestE >= eMax;
            method = OptimumMethod.ClosedForm;
        }
        double bestF = cycle.Objective(bestE);
        var band = Band(cycle, bestE, bestF * 0.99, eMax);
        var scaled = maxima
            .Select(m => m with { OutputPerPerson = m.OutputPerPerson * outputPerEffectiveWorker }).ToList();
        return new OptimumResult(
            bestE, bestF * outputPerEffectiveWorker, method, whyNot, band, atBoundary, eMax, scaled,
            new SolverDiagnostics(gridPoints + 1, iterations, converged, Tolerance, refinement));
    }

    /// <summary>
    /// The local maximum nearest to <paramref name="guess"/>: steps of two years downhill-to-uphill to bracket a sign
    /// change of d ln(h·ω)/dE, then bisection to 1e-6 years. Used where thousands of evaluations are needed
    /// (Monte Carlo, Sobol, grids), starting from the full search's optimum for the central scenario.
    /// </summary>
    public static double LocalFrom(
        Demography demography, HumanCapital humanCapital, double guess, double? population = null, bool fast = false)
    {
        var cycle = new LifeCycle(demography, humanCapital, population, fast);
        double eMax = cycle.MaxSchooling;
        double lo = Math.Clamp(guess, 0, eMax), hi = lo;
        double fLo = cycle.ObjectiveLogSlope(lo), fHi = fLo;
        const double step = 2.0;
        if (fLo > 0)
        {
            do { lo = hi; fLo = fHi; hi = Math.Min(eMax, hi + step); fHi = cycle.ObjectiveLogSlope(hi); }
            while (hi < eMax && fHi > 0);
            if (fHi > 0) return eMax;
        }
        else
        {
            do { hi = lo; fHi = fLo; lo = Math.Max(0, lo - step); fLo = cycle.ObjectiveLogSlope(lo); }
            while (lo > 0 && fLo <= 0);
            if (fLo <= 0) return 0;
        }
        if (double.IsInfinity(fHi)) fHi = -1e6;
        // Illinois regula falsi on the slope: superlinear, and the bracket always holds the root.
        int side = 0;
        for (int i = 0; i < 60 && hi - lo > 1e-7; i++)
        {
            double mid = (lo * fHi - hi * fLo) / (fHi - fLo);
            if (!(mid > lo && mid < hi)) mid = 0.5 * (lo + hi);
            double fMid = cycle.ObjectiveLogSlope(mid);
            if (Math.Abs(fMid) < 1e-12) return mid;
            if (fMid > 0) { lo = mid; fLo = fMid; if (side == -1) fHi /= 2; side = -1; }
            else { hi = mid; fHi = fMid; if (side == 1) fLo /= 2; side = 1; }
        }
        return 0.5 * (lo + hi);
    }

    /// <summary>Why the closed form E* = R − a₀ + ln(1 − n/r)/n does not apply, or null when it does (the brief and
    /// the results writer word it).</summary>
    public static ClosedFormObstacle? WhyNotClosedForm(Demography demography, HumanCapital humanCapital)
    {
        if (humanCapital.Returns is not ConstantReturn c) return ClosedFormObstacle.ReturnNotConstant;
        if (demography.Survival is not RectangularSurvival) return ClosedFormObstacle.SurvivalNotRectangular;
        if (humanCapital.Experience is not null) return ClosedFormObstacle.ExperienceProfile;
        if (!(c.Rate > demography.GrowthRate)) return ClosedFormObstacle.ReturnBelowGrowth;
        return null;
    }

    /// <summary>
    /// Working years at the optimum W* = −ln(1 − n/r)/n (→ 1/r as n → 0); E* = R − a₀ − W*, clamped to the feasible
    /// range.
    /// </summary>
    public static double ClosedForm(Demography demography, double rate, double maxSchooling)
    {
        double n = demography.GrowthRate;
        double working = Math.Abs(n / rate) < 1e-12 ? 1.0 / rate : -Numerics.Stable.Log1p(-n / rate) / n;
        double end = Math.Min(demography.RetirementAge, demography.Survival.MaxAge);
        return Math.Clamp(end - demography.EntryAge - working, 0.0, maxSchooling);
    }

    private static (double E, int Iterations, bool Converged, RefinementMethod How) Refine(
        LifeCycle cycle, double lo, double hi)
    {
        if (cycle.ObjectiveLogSlope(lo) > 0 && cycle.ObjectiveLogSlope(hi) < 0)
        {
            int it = 0;
            while (hi - lo > Tolerance && it < 200)
            {
                double mid = 0.5 * (lo + hi);
                if (cycle.ObjectiveLogSlope(mid) > 0) lo = mid; else hi = mid;
                it++;
            }
            return (0.5 * (lo + hi), it, hi - lo <= Tolerance, RefinementMethod.DerivativeBisection);
        }
        return GoldenSection(cycle, lo, hi);
    }

    private static (double E, int Iterations, bool Converged, RefinementMethod How) GoldenSection(
        LifeCycle cycle, double lo, double hi)
    {
        var (a, b, it) = Numerics.GoldenSection.Maximise(cycle.Objective, lo, hi, 1e-8);
        return (0.5 * (a + b), it, b - a <= 1e-8, RefinementMethod.GoldenSection);
    }

    /// <summary>[low, high]: the connected range around E* where h·ω stays at or above the threshold.</summary>
    private static double[] Band(LifeCycle cycle, double best, double threshold, double eMax)
    {
        const double step = 0.25;
        double Edge(double direction, double limit)
        {
            double inside = best, outside = best;
            while (true)
            {
                double next = Math.Clamp(outside + direction * step, 0.0, eMax);
                if (next == outside) return limit;
                if (cycle.Objective(next) < threshold) { outside = next; break; }
                inside = outside = next;
            }
            for (int i = 0; i < 60 && Math.Abs(outside - inside) > 1e-9; i++)
            {
                double mid = 0.5 * (inside + outside);
                if (cycle.Objective(mid) >= threshold) inside = mid; else outside = mid;
            }
            return inside;
        }
        return new[] { Edge(-1, 0.0), Edge(+1, eMax) };
    }
}
