using Briefwright.Model.Uncertainty;

namespace Briefwright.Templating.Tests;

public class ProbabilityWordsTests
{
    [Fact]
    public void All_draws_showing_a_gain_is_said_as_the_lower_bound_of_its_interval_never_as_a_certainty()
    {
        // Wilson (1927) interval for 2,000 of 2,000: lower bound 1 − z²/(n + z²) = 0.99808.
        var p = Probability.Of(2000, 2000);
        Assert.Equal("99.8% or more (all 2,000 draws; 95% interval)", ProbabilityWords.Sentence(p));
        Assert.Equal("99.8% or more", ProbabilityWords.Cell(p));
        Assert.DoesNotContain("100", ProbabilityWords.Sentence(p));
    }

    [Fact]
    public void No_draw_showing_the_event_is_said_as_the_upper_bound()
    {
        // 0 of 20: upper bound z²/(n + z²) = 0.1611 (Newcombe 1998, Table II; recalled from memory).
        Assert.Equal(
            "16.1% or less (none of 20 draws; 95% interval)",
            ProbabilityWords.Sentence(Probability.Of(0, 20)));
    }

    [Fact]
    public void A_probability_between_is_given_with_its_interval()
    {
        // 81 of 263: Wilson interval 25.5% to 36.6% (Newcombe 1998, Table II; recalled from memory).
        Assert.Equal("30.8% (95% interval 25.5% to 36.6%)", ProbabilityWords.Sentence(Probability.Of(81, 263)));
        Assert.Equal("30.8% (25.5%–36.6%)", ProbabilityWords.Cell(Probability.Of(81, 263)));
    }
}
