using Briefwright.Model.Numerics;

namespace Briefwright.Model.Tests;

public class GoldenSectionTests
{
    // Worked example: the maximum of −(x − 2)² on [0, 5] is at x = 2 (exact by calculus). Each step shrinks the
    // bracket by (√5 − 1)/2 (Kiefer 1953; Press et al., Numerical Recipes, 3rd ed., §10.2), so reaching a width of
    // 1e-8 from 5 takes ceil(ln(5e8) / ln(1/0.618…)) = 42 steps.
    [Fact]
    public void Finds_the_maximum_of_a_parabola_in_the_predicted_number_of_steps()
    {
        var (lo, hi, it) = GoldenSection.Maximise(x => -(x - 2) * (x - 2), 0, 5, 1e-8);
        Assert.InRange(2.0, lo - 1e-12, hi + 1e-12);
        Assert.True(hi - lo <= 1e-8);
        Assert.Equal((int)Math.Ceiling(Math.Log(5e8) / Math.Log(2 / (Math.Sqrt(5) - 1))), it);
        Assert.Equal(42, it);
    }

    [Fact]
    public void Stops_at_the_step_limit_when_the_tolerance_cannot_be_met()
    {
        var (lo, hi, it) = GoldenSection.Maximise(x => -x * x, -1, 1, 0, maxIterations: 7);
        Assert.Equal(7, it);
        Assert.True(hi - lo > 0);
    }
}
