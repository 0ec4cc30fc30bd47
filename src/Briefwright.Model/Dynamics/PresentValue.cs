namespace Briefwright.Model.Dynamics;

/// <summary>
/// Present value of a reform's gain in output per person, in multiples of today's annual output per person:
/// PV = Σ_{t=0..H} D(t)·e^(gt)·gain(t). Beyond the horizon H the gain is taken at its balanced-growth value and
/// the tail is summed exactly (explicitly to the schedule's last step, then as a geometric series); when the last
/// discount rate does not exceed growth the tail has no finite value, and only the value to the horizon is given.
/// </summary>
public sealed record PresentValue(
    string ScheduleId,
    string ScheduleLabel,
    double ToHorizon,
    double? Tail,
    double? Total,
    int? BreakEvenYear,
    string TailNote)
{
    private static readonly System.Collections.Concurrent.ConcurrentDictionary<(DiscountSchedule Schedule, int Horizon), double[]> FactorCache = new();

    public static PresentValue Compute(ReformPath path, DiscountSchedule schedule, double technologyGrowth)
    {
        int h = path.Horizon;
        var d = Factors(schedule, h);
        var cumulative = new double[h + 1];
        double sum = Sum(path, d, technologyGrowth, cumulative);
        // Break-even: the first year from which the cumulative discounted gain stays positive to the horizon.
        int? breakEven = null;
        for (int t = h; t >= 0 && cumulative[t] > 0; t--) breakEven = t;
        var (tail, note) = TailValue(schedule, d[h], h, technologyGrowth, path.BalancedGrowthGain);
        return new PresentValue(schedule.Id, schedule.Label, sum, tail, tail is null ? null : sum + tail, breakEven, note);
    }

    /// <summary>The present value to the horizon alone, the same sum as <see cref="Compute"/>'s <see cref="ToHorizon"/>; allocates nothing (Monte Carlo and Sobol runs).</summary>
    public static double ToHorizonOnly(ReformPath path, DiscountSchedule schedule, double technologyGrowth) =>
        Sum(path, Factors(schedule, path.Horizon), technologyGrowth, default);

    private static double[] Factors(DiscountSchedule schedule, int horizon) => FactorCache.GetOrAdd((schedule, horizon), key => key.Schedule.Factors(key.Horizon));

    /// <summary>Σ_{t=0..H} D(t)·e^(gt)·gain(t), with the running sums written to <paramref name="cumulative"/> when it is not empty.</summary>
    private static double Sum(ReformPath path, double[] d, double technologyGrowth, Span<double> cumulative)
    {
        double sum = 0, growth = 1, step = Math.Exp(technologyGrowth);
        for (int t = 0; t <= path.Horizon; t++)
        {
            sum += d[t] * growth * path.Gain[t];
            if (!cumulative.IsEmpty) cumulative[t] = sum;
            growth *= step;
        }
        return sum;
    }

    private static (double? Tail, string Note) TailValue(DiscountSchedule schedule, double dH, int h, double g, double longRunGain)
    {
        int lastStart = schedule.Steps[^1].FromYear;
        double lastRate = schedule.Steps[^1].Rate;
        double q = Math.Exp(g) / (1 + lastRate);
        if (q >= 1)
            return (null, $"beyond year {h} the gain is not counted: the long-run discount rate ({(lastRate * 100).ToString("0.0", System.Globalization.CultureInfo.InvariantCulture)}%) does not exceed technology growth ({(g * 100).ToString("0.0", System.Globalization.CultureInfo.InvariantCulture)}%), so the tail has no finite value");
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
        return (sum, $"beyond year {h} the gain is held at its balanced-growth value ({(longRunGain * 100).ToString("0.00", System.Globalization.CultureInfo.InvariantCulture)}%) and discounted to infinity");
    }
}
