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
    [InlineData(12, "12 years")]
    [InlineData(1, "1 year")]
    public void Years_names_the_unit(double value, string expected) => Assert.Equal(expected, Years(value));

    [Fact]
    public void Date_is_written_out_in_full() => Assert.Equal("30 November 2026", Date("2026-11-30"));

    [Fact]
    public void A_non_finite_number_is_refused_rather_than_printed() =>
        Assert.Throws<InvalidOperationException>(() => Num(double.NaN));
}
