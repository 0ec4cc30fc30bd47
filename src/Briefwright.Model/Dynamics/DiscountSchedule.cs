namespace Briefwright.Model.Dynamics;

/// <summary>
/// A step of a discount schedule: from <see cref="FromYear"/> on (years counted from 1), the annual rate.
/// </summary>
public sealed record DiscountStep(int FromYear, double Rate);

/// <summary>
/// A social discount rate, constant or declining. Discount factor D(t) = Π_{y=1..t} 1/(1 + r(y)), D(0) = 1.
/// </summary>
public sealed record DiscountSchedule(string Id, string Label, IReadOnlyList<DiscountStep> Steps)
{
    /// <summary>
    /// HM Treasury Green Book (2003, Table 6.1; kept in 2018/2020): 3.5% for years 0–30, 3.0% 31–75, 2.5% 76–125, 2.0%
    /// 126–200, 1.5% 201–300, 1.0% after.
    /// </summary>
    public static DiscountSchedule GreenBook { get; } = new("green-book", "UK Green Book, declining from 3.5%", new[]
    {
        new DiscountStep(1, 0.035), new DiscountStep(31, 0.030), new DiscountStep(76, 0.025),
        new DiscountStep(126, 0.020), new DiscountStep(201, 0.015), new DiscountStep(301, 0.010),
    });

    /// <summary>US OMB Circular A-4 (2003): 3% real.</summary>
    public static DiscountSchedule Omb3 { get; } = Constant("omb-3", "US OMB Circular A-4, 3%", 0.03);

    /// <summary>US OMB Circular A-4 (2003): 7% real.</summary>
    public static DiscountSchedule Omb7 { get; } = Constant("omb-7", "US OMB Circular A-4, 7%", 0.07);

    public static IReadOnlyList<DiscountSchedule> Published { get; } = new[] { GreenBook, Omb3, Omb7 };

    public static DiscountSchedule Constant(string id, string label, double rate) =>
        new(id, label, new[] { new DiscountStep(1, rate) });

    public double RateInYear(int year)
    {
        double rate = Steps[0].Rate;
        foreach (var s in Steps)
            if (year >= s.FromYear) rate = s.Rate;
        return rate;
    }

    /// <summary>D(0..horizon).</summary>
    public double[] Factors(int horizon)
    {
        var d = new double[horizon + 1];
        d[0] = 1;
        for (int t = 1; t <= horizon; t++) d[t] = d[t - 1] / (1 + RateInYear(t));
        return d;
    }

    public double Factor(int year) => Factors(year)[year];
}
