using Briefwright.Model.Inputs;

namespace Briefwright.Model.Tests;

public class InputsTests
{
    [Fact]
    public void Gompertz_Makeham_survival_from_20_to_65_matches_the_Standard_Ultimate_Life_Table()
    {
        // Society of Actuaries Standard Ultimate Life Table: A = 0.00022, B = 2.7e-6, c = 1.124; l(65)/l(20) =
        // 0.945797.
        var s = new GompertzMakehamSurvival(0.00022, 2.7e-6, 1.124, 120);
        Assert.Equal(0.945797, s.At(65) / s.At(20), 6);
    }

    [Fact]
    public void Mincer_experience_profile_peaks_at_33_75_years()
    {
        // Mincer (1974), Table 5.1: ln y = 6.20 + 0.107 S + 0.081 X − 0.0012 X²; peak at 0.081 / 0.0024 = 33.75.
        var p = new ExperienceProfile(0.081, 0.0012);
        Assert.Equal(33.75, p.PeakYears, 10);
        Assert.True(p.LogPremium(33.75) > p.LogPremium(33.0) && p.LogPremium(33.75) > p.LogPremium(34.5));
    }

    [Fact]
    public void Life_table_interpolates_linearly_and_is_zero_after_the_last_age()
    {
        var t = new TabulatedSurvival(new double[] { 0, 10, 20 }, new[] { 1.0, 0.9, 0.5 });
        Assert.Equal(0.95, t.At(5), 12);
        Assert.Equal(0.7, t.At(15), 12);
        Assert.Equal(0.0, t.At(20.5));
    }

    [Theory]
    [InlineData(1.0)]
    [InlineData(6.0)]
    [InlineData(12.0)]
    [InlineData(20.0)]
    public void Power_form_log_human_capital_is_the_integral_of_its_marginal_return(double years)
    {
        // Bils & Klenow (2000), AER 90(5): the Mincerian return to the s-th year is θ·s^(−ψ), so
        // φ(E) = ∫₀^E θ·s^(−ψ) ds. Independent route: that integral by double-exponential quadrature (Math.NET) after
        // the substitution s = x⁴, which removes the singularity at 0. θ = 0.32, ψ = 0.58 are recalled from memory.
        var p = new PowerReturn(0.32, 0.58);
        double integral = MathNet.Numerics.Integrate.DoubleExponential(
            x => 0.32 * Math.Pow(x * x * x * x, -0.58) * 4 * x * x * x,
            0,
            Math.Pow(years, 0.25),
            1e-13);
        Assert.Equal(integral, p.Phi(years), 8);
        // The marginal return is the slope of φ (central difference) and falls with schooling.
        double h = 1e-5;
        Assert.Equal(
            (p.Phi(years + h) - p.Phi(years - Math.Min(h, years / 2))) / (h + Math.Min(h, years / 2)),
            p.MarginalReturn(years),
            6);
        Assert.True(p.MarginalReturn(years) > p.MarginalReturn(years + 1));
    }
}
