using System.Collections.Concurrent;

namespace Briefwright.Model.Dynamics;

/// <summary>How the value beyond the horizon is treated.</summary>
public enum TailTreatment
{
    /// <summary>The gain is held at its balanced-growth value and discounted to infinity (a finite tail).</summary>
    HeldAtBalancedGrowth,

    /// <summary>The long-run discount rate does not exceed technology growth: no finite value, not counted.</summary>
    NotFinite,
}

/// <summary>The tail's treatment with the numbers a description of it needs (fractions).</summary>
public sealed record TailBasis(TailTreatment Treatment, double LongRunRate, double TechnologyGrowth, double HeldGain);

/// <summary>
/// Present value of a reform's gain in output per person, valued at a stated calendar year V (the valuation date,
/// where technology is 1 and the discount factor is 1), in years of output per person at V. The reform starts o = R − V
/// years later; the gain of year t after the reform is a flow at time o + t:
/// PV = Σ_{t=0..H} D(o+t)·e^(g(o+t))·gain(t), with D counted from the valuation date (so a declining schedule steps
/// down 30, 75, … years after V, not after the reform). Beyond the horizon H the gain is taken at its balanced-growth
/// value and the tail is summed exactly (explicitly to the schedule's last step, then as a geometric series); when the
/// last discount rate does not exceed growth the tail has no finite value, and only the value to the horizon is given.
/// </summary>
public sealed record PresentValue(
    string ScheduleId,
    string ScheduleLabel,
    int ValuationYear,
    double DiscountFactorToReform,
    double ToHorizon,
    double? Tail,
    double? Total,
    int? BreakEvenYear,
    int? BreakEvenCalendarYear,
    TailBasis TailBasis)
{
    private static readonly ConcurrentDictionary<(DiscountSchedule Schedule, int Horizon), double[]> FactorCache =
        new();

    /// <summary>The value to the horizon plus the tail where it is finite, else the value to the horizon.</summary>
    public double Counted => Total ?? ToHorizon;

    /// <param name="valuationOffset">Years from the valuation date to the reform year (0: valued at the reform
    /// year).</param>
    public static PresentValue Compute(
        ReformPath path, DiscountSchedule schedule, double technologyGrowth, int valuationOffset = 0)
    {
        int h = path.Horizon, o = CheckOffset(valuationOffset);
        var d = Factors(schedule, o + h);
        var cumulative = new double[h + 1];
        double sum = Sum(path, d, technologyGrowth, o, cumulative);
        // Break-even: the first year from which the cumulative discounted gain stays positive to the horizon.
        int? breakEven = null;
        for (int t = h; t >= 0 && cumulative[t] > 0; t--) breakEven = t;
        var (tail, note) = TailValue(schedule, d[o + h], o + h, technologyGrowth, path.BalancedGrowthGain);
        return new PresentValue(
            schedule.Id, schedule.Label, path.ReformYear - o, d[o], sum, tail, tail is null ? null : sum + tail,
            breakEven, path.ReformYear + breakEven, note);
    }

    /// <summary>
    /// The present value to the horizon alone, the same sum as <see cref="Compute"/>'s <see cref="ToHorizon"/>;
    /// allocates nothing (Monte Carlo and Sobol runs).
    /// </summary>
    public static double ToHorizonOnly(
        ReformPath path, DiscountSchedule schedule, double technologyGrowth, int valuationOffset = 0)
    {
        int o = CheckOffset(valuationOffset);
        return Sum(path, Factors(schedule, o + path.Horizon), technologyGrowth, o, default);
    }

    private static int CheckOffset(int offset) =>
        offset >= 0 ? offset : throw new ArgumentOutOfRangeException(nameof(offset), offset,
            "The valuation date must not follow the reform year.");

    /// <summary>Schedules and horizons whose factors are kept; a process that meets more (a long batch of briefs with
    /// rules of their own) starts the cache afresh rather than let it grow. Factors are recomputed the same.</summary>
    internal const int MaxCachedFactors = 256;

    private static double[] Factors(DiscountSchedule schedule, int horizon)
    {
        if (FactorCache.TryGetValue((schedule, horizon), out var known)) return known;
        if (FactorCache.Count >= MaxCachedFactors) FactorCache.Clear();
        return FactorCache.GetOrAdd((schedule, horizon), key => key.Schedule.Factors(key.Horizon));
    }

    internal static int CachedFactors => FactorCache.Count;

    /// <summary>
    /// Σ_{t=0..H} D(o+t)·e^(g(o+t))·gain(t), with the running sums written to <paramref name="cumulative"/> when it is
    /// not empty.
    /// </summary>
    private static double Sum(ReformPath path, double[] d, double technologyGrowth, int offset, Span<double> cumulative)
    {
        double sum = 0, growth = offset == 0 ? 1 : Math.Exp(technologyGrowth * offset),
            step = Math.Exp(technologyGrowth);
        for (int t = 0; t <= path.Horizon; t++)
        {
            sum += d[offset + t] * growth * path.Gain[t];
            if (!cumulative.IsEmpty) cumulative[t] = sum;
            growth *= step;
        }
        return sum;
    }

    /// <param name="dH">D at the horizon, <paramref name="h"/> years after the valuation date.</param>
    private static (double? Tail, TailBasis Basis) TailValue(
        DiscountSchedule schedule, double dH, int h, double g, double longRunGain)
    {
        int lastStart = schedule.Steps[^1].FromYear;
        double lastRate = schedule.Steps[^1].Rate;
        double q = Math.Exp(g) / (1 + lastRate);
        if (q >= 1)
            return (null, new TailBasis(TailTreatment.NotFinite, lastRate, g, longRunGain));
        double sum = 0, factor = dH;
        int t = h;
        while (t + 1 < lastStart)
        {
            t++;
            factor /= 1 + schedule.RateInYear(t);
            sum += factor * Math.Exp(g * t) * longRunGain;
        }
        // From year t + 1 on the rate is the last one: Σ_{j≥1} factor·e^(gt)·q^j = factor·e^(gt)·q/(1 − q).
        sum += factor * Math.Exp(g * t) * longRunGain * q / (1 - q);
        return (sum, new TailBasis(TailTreatment.HeldAtBalancedGrowth, lastRate, g, longRunGain));
    }
}
