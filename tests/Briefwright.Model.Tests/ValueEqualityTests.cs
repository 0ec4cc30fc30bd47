using Briefwright.Model.Core;
using Briefwright.Model.Dynamics;
using Briefwright.Model.Uncertainty;

namespace Briefwright.Model.Tests;

/// <summary>Results that hold arrays compare by value: two computations alike are equal, one changed number is
/// not.</summary>
public class ValueEqualityTests
{
    private static readonly ReformSettings Reform = new(2028, 1, 80);

    private static ReformPath Path() =>
        ReformSimulator.Simulate(ReformSimulatorTests.Inputs(),
            ReformSimulatorTests.Inputs().Options.Single(o => o.Id == "plus1"), Reform);

    [Fact]
    public void Reform_paths_computed_alike_are_equal_and_hash_alike()
    {
        ReformPath a = Path(), b = Path();
        Assert.NotSame(a.Gain, b.Gain);
        Assert.Equal(a, b);
        Assert.Equal(a.GetHashCode(), b.GetHashCode());
    }

    [Fact]
    public void A_reform_path_with_one_gain_changed_differs()
    {
        var a = Path();
        var gain = (double[])a.Gain.Clone();
        gain[^1] += 1e-12;
        Assert.NotEqual(a, a with { Gain = gain });
        Assert.NotEqual(a, a with { ReformYear = a.ReformYear + 1 });
    }

    [Fact]
    public void Optimum_results_present_values_and_appraisals_compare_by_value()
    {
        var inputs = ReformSimulatorTests.Inputs();
        var one = OptimumSearch.Find(inputs.Demography, inputs.HumanCapital, 1.0);
        var two = OptimumSearch.Find(inputs.Demography, inputs.HumanCapital, 1.0);
        Assert.Equal(one, two);
        Assert.NotEqual(one, two with { Within1Pct = [two.Within1Pct[0], two.Within1Pct[1] + 0.5] });

        var schedules = new[] { DiscountSchedule.GreenBook, DiscountSchedule.Omb3 };
        var x = Appraisal.Run(inputs, Reform, schedules, one.SchoolingYears);
        var y = Appraisal.Run(inputs, Reform, schedules, one.SchoolingYears);
        Assert.Equal(x, y);
        Assert.Equal(x.GetHashCode(), y.GetHashCode());
        var pvs = x.Options[0].PresentValues.Reverse().ToList();
        Assert.NotEqual(x, x with { Options = [x.Options[0] with { PresentValues = pvs }] });
    }

    [Fact]
    public void Key_results_and_grids_compare_by_value()
    {
        var a = new KeyResults(["a", "b"], [1.0, 2.0], [0.5, double.NaN], 30);
        var b = new KeyResults(new List<string> { "a", "b" }, [1.0, 2.0], [0.5, double.NaN], 30);
        Assert.Equal(a, b);
        Assert.NotEqual(a, b with { LongRunChangePct = [1.0, 2.5] });
        Assert.Equal(2.0, a.LongRunChangeOf("b"));

        var spec = new GridSpec("saving_rate", 0.1, 0.3, "participation", 0.5, 0.9, 2, "change");
        var g = new GridResult(spec, [0.1, 0.3], [0.5, 0.9], [[1.0, null], [2.0, 3.0]], 1);
        var h = new GridResult(spec, [0.1, 0.3], [0.5, 0.9], [[1.0, null], [2.0, 3.0]], 1);
        Assert.Equal(g, h);
        Assert.NotEqual(g, h with { Values = [[1.0, null], [2.0, 4.0]] });
    }
}
