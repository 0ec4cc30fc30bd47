using Briefwright.Model.Uncertainty;

namespace Briefwright.Templating.Tests;

/// <summary>Words chosen from numbers: each branch of the sentences page 1 is made of.</summary>
public class WordingTests
{
    private static HeadlineFacts Facts(
        double change,
        double? dip = null,
        int? dipYear = null,
        double? peak = null,
        int? peakYear = null,
        int? above = null,
        int? below = null,
        int? breakEven = null) =>
        new(
            "x",
            change,
            HeadlineFacts.Of(change),
            null,
            null,
            null,
            dip,
            dipYear,
            peak,
            peakYear,
            above,
            below,
            "r",
            breakEven,
            0.5,
            2178);

    [Theory]
    [InlineData(4.08, "would raise long-run output per person by 4.1%")]
    [InlineData(-2.74, "would lower long-run output per person by 2.7%")]
    [InlineData(0.04, "would leave long-run output per person unchanged (a change of less than 0.05%)")]
    [InlineData(-0.04, "would leave long-run output per person unchanged (a change of less than 0.05%)")]
    public void Effect_takes_its_verb_from_the_sign_as_shown(double change, string expected)
        => Assert.Equal(expected, Wording.Effect(change));

    [Fact]
    public void A_dip_then_a_gain_is_told_in_that_order() =>
        Assert.Equal("Output per person first falls below the path without the reform, by up to 0.7% in 2048, and is " +
            "above it from 2066.",
            Wording.Arrival(Facts(4.1, dip: -0.74, dipYear: 2048, peak: 4.0, peakYear: 2178, above: 2066), 2028));

    [Fact]
    public void A_cut_that_gains_first_and_loses_later_is_told_in_that_order() =>
        Assert.Equal("Output per person first rises above the path without the reform, by up to 3.1% in 2040, and is " +
            "below it from 2054.",
            Wording.Arrival(Facts(-10.2, dip: -10, dipYear: 2178, peak: 3.1, peakYear: 2040, below: 2054), 2028));

    [Fact]
    public void A_reform_that_never_breaks_even_says_so_within_the_horizon() =>
        Assert.Equal("Discounted at a 12% rule, the reform does not pay back within the horizon to 2178.",
            Wording.Payback(Facts(5.5, dip: -1.8, dipYear: 2040, above: 2055), "a 12% rule", 2028));

    [Fact]
    public void A_falling_option_is_never_said_to_pay_back() =>
        Assert.DoesNotContain(
            "pays back",
            Wording.Payback(Facts(-2.4, dip: -2.8, dipYear: 2052, below: 2030), "a rule", 2028));

    [Theory]
    [InlineData(new[] { 1.0, 2.0, 3.0 }, "rises")]
    [InlineData(new[] { 3.0, 2.0, 1.0 }, "falls")]
    [InlineData(new[] { 1.0, 3.0, 2.0 }, "rises, then falls")]
    [InlineData(new[] { 1.0, 3.0, 2.0, 4.0 }, "rises and falls more than once")]
    [InlineData(new[] { 2.0, 2.0 }, "stays the same")]
    public void Trend_describes_the_shape_it_is_given(double[] values, string expected)
        => Assert.Equal(expected, Wording.Trend(values));
}
