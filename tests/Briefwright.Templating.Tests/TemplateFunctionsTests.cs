using static Briefwright.Templating.TemplateFunctions;

namespace Briefwright.Templating.Tests;

public class TemplateFunctionsTests
{
    [Theory]
    [InlineData(0.0412, 1, "4.1%")]
    [InlineData(0.009, 1, "0.9%")]
    [InlineData(-0.004, 1, "−0.4%")]
    [InlineData(-0.0001, 1, "0.0%")]
    public void Pct_formats_fractions_as_percentages_with_a_true_minus(double value, int digits, string expected) =>
        Assert.Equal(expected, Pct(value, digits));

    [Theory]
    [InlineData(4.08, "+4.1%")]
    [InlineData(-0.26, "−0.3%")]
    [InlineData(0.01, "0.0%")]
    public void Change_carries_its_sign(double value, string expected) => Assert.Equal(expected, Change(value));

    [Theory]
    [InlineData(0.000412345, 3, "0.000412")]
    [InlineData(3.0e-6, 4, "0.000003")]
    [InlineData(1234.5678, 3, "1235")]
    [InlineData(1.124, 4, "1.124")]
    public void Sig_keeps_significant_digits_and_drops_trailing_zeros(double value, int digits, string expected) =>
        Assert.Equal(expected, Sig(value, digits));

    [Fact]
    public void Big_uses_thousands_separators() => Assert.Equal("1,234,567", Big(1234567));

    [Theory]
    [InlineData(34.51, "34.5 years")]
    [InlineData(28, "28.0 years")]
    [InlineData(12, "12.0 years")]
    public void Years_are_always_shown_to_one_decimal_with_their_unit(double value, string expected)
        => Assert.Equal(expected, Years(value));

    // The formatting policy of docs/templates.md (common practice in official statistics publications: present values
    // to two significant figures, sample proportions never printed as certainties).
    [Theory]
    [InlineData(0.8213, "0.82")]
    [InlineData(3.449, "3.4")]
    [InlineData(12.34, "12")]
    [InlineData(123.4, "120")]
    [InlineData(9.96, "10")]
    [InlineData(0.002, "< 0.01")]
    [InlineData(-0.004, "> −0.01")]
    [InlineData(-0.35, "−0.35")]
    [InlineData(0, "0")]
    public void Pv_keeps_two_significant_figures_and_says_below_a_hundredth(double value, string expected)
        => Assert.Equal(expected, Pv(value));

    [Theory]
    [InlineData(1.0, "> 99.9%")]
    [InlineData(0.99996, "> 99.9%")]
    [InlineData(0.0, "< 0.1%")]
    [InlineData(0.0004, "< 0.1%")]
    [InlineData(0.27, "27.0%")]
    public void Prob_never_prints_a_certainty_from_a_sample(double value, string expected)
        => Assert.Equal(expected, Prob(value));

    [Theory]
    [InlineData(1e-10, "less than a billionth")]
    [InlineData(1e-6, "less than a millionth")]
    [InlineData(0.5, "0.5")]
    public void Small_writes_tolerances_without_exponents(double value, string expected)
        => Assert.Equal(expected, Small(value));

    [Fact]
    public void Date_is_written_out_in_full() => Assert.Equal("30 November 2026", Date("2026-11-30"));

    [Fact]
    public void A_non_finite_number_is_refused_rather_than_printed() =>
        Assert.Throws<InvalidOperationException>(() => Num(double.NaN));
}
