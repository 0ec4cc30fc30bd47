using Briefwright.Model.Dynamics;
using Briefwright.Model.Inputs;

namespace Briefwright.Model.Tests;

public class PresentValueTests
{
    [Fact]
    public void Green_Book_discount_factor_for_year_50_is_0_19727()
    {
        // HM Treasury Green Book (2003), Table 6.1: 3.5% for years 1–30, then 3.0%: 1/(1.035^30 × 1.03^20) = 0.19727
        // as quoted (the exact value is 0.197263, so the quoted figure is good to 1e-5).
        Assert.InRange(DiscountSchedule.GreenBook.Factor(50), 0.19727 - 1e-5, 0.19727 + 1e-5);
        Assert.Equal(1 / (Math.Pow(1.035, 30) * Math.Pow(1.03, 20)), DiscountSchedule.GreenBook.Factor(50), 14);
    }

    [Fact]
    public void Green_Book_rates_step_down_at_the_published_years()
    {
        var gb = DiscountSchedule.GreenBook;
        Assert.Equal(new[] { 0.035, 0.035, 0.030, 0.030, 0.025, 0.025, 0.020, 0.020, 0.015, 0.015, 0.010 },
            new[] { 1, 30, 31, 75, 76, 125, 126, 200, 201, 300, 301 }.Select(gb.RateInYear).ToArray());
    }

    [Fact]
    public void Omb_constant_rates_discount_geometrically()
    {
        // US OMB Circular A-4 (2003): 3% and 7% real.
        Assert.Equal(Math.Pow(1.07, -10), DiscountSchedule.Omb7.Factor(10), 14);
        Assert.Equal(Math.Pow(1.03, -40), DiscountSchedule.Omb3.Factor(40), 14);
    }

    private static ReformPath Constant(double gain, int horizon) =>
        new("x", Enumerable.Repeat(gain, horizon + 1).ToArray(), gain, gain, null, null, 0);

    [Fact]
    public void Tail_beyond_the_horizon_equals_the_brute_force_sum()
    {
        // Independent route: sum a constant gain year by year to 20,000 years.
        double g = 0.015;
        var path = Constant(0.05, 100);
        var pv = PresentValue.Compute(path, DiscountSchedule.GreenBook with { Steps = DiscountSchedule.GreenBook.Steps.Take(4).ToList() }, g);
        var longPath = Constant(0.05, 20_000);
        var brute = PresentValue.Compute(longPath, DiscountSchedule.GreenBook with { Steps = DiscountSchedule.GreenBook.Steps.Take(4).ToList() }, g);
        Assert.Equal(brute.ToHorizon, pv.Total!.Value, 8);
    }

    [Fact]
    public void A_tail_that_does_not_converge_is_left_out_and_said_so()
    {
        var pv = PresentValue.Compute(Constant(0.05, 100), DiscountSchedule.GreenBook, 0.015);
        Assert.Null(pv.Total);
        Assert.Contains("no finite value", pv.TailNote);
    }

    [Fact]
    public void Break_even_is_the_first_year_from_which_the_cumulative_gain_stays_positive()
    {
        var gain = new double[31];
        for (int t = 0; t < 31; t++) gain[t] = t < 10 ? -0.01 : 0.03;
        var pv = PresentValue.Compute(new ReformPath("x", gain, 0.02, 0.02, -0.01, 0, 10), DiscountSchedule.Constant("zero", "0%", 0.0), 0.0);
        // Cumulative: −0.10 after year 9, then +0.03 a year: −0.07, −0.04, −0.01, +0.02 at year 13.
        Assert.Equal(13, pv.BreakEvenYear);
    }

    [Fact]
    public void The_value_to_the_horizon_alone_is_the_same_number_as_the_full_computation()
    {
        // Monte Carlo and Sobol runs ask only for the value to the horizon; it must be the very number the brief's
        // present-value table shows (same sum, same order), for every schedule and for paths with a dip.
        var inputs = ReformSimulatorTests.Inputs(experience: new ExperienceProfile(0.081, 0.0012));
        var schedules = new[] { DiscountSchedule.GreenBook, DiscountSchedule.Omb3, DiscountSchedule.Omb7, DiscountSchedule.Constant("zero", "0%", 0.0) };
        foreach (var option in inputs.Options.Where(o => o.Id != "base"))
        {
            var path = ReformSimulator.Simulate(inputs, option, new ReformSettings(2027, 2, 150));
            foreach (var schedule in schedules)
                Assert.Equal(PresentValue.Compute(path, schedule, 0.015).ToHorizon, PresentValue.ToHorizonOnly(path, schedule, 0.015));
        }
    }
}
