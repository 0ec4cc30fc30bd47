using System.Text;
using Briefwright.Model.Inputs;
using Briefwright.Model.Results;
using static Briefwright.Templating.TemplateFunctions;

namespace Briefwright.Templating;

/// <summary>The technical annex: the model's equations and how each number was computed.</summary>
public static class Equations
{
    public static string Annex(ModelInputs inputs, BalancedGrowthResults r)
    {
        var sb = new StringBuilder();
        sb.Append("People enter school at age a₀, study E years, then work until the retirement age R with participation p. ")
          .Append("The population is stable, growing at rate n, with survival l(a) up to the oldest age Ω.\n\n");
        // Display equations in the math notation the composer typesets (docs/templates.md): $$ … $$ on their own.
        sb.Append("**Worker share**, the share of the population at work:\n\n")
          .Append("$$\\omega(E) = p \\cdot \\frac{\\int_{a_0+E}^{R} e^{-na}\\, l(a)\\, da}{\\int_{0}^{\\Omega} e^{-na}\\, l(a)\\, da}$$\n\n");
        sb.Append("**Human capital per worker**, with " + ScheduleText(inputs.HumanCapital) + ":\n\n")
          .Append(inputs.HumanCapital.Experience is null ? "$$h(E) = e^{\\phi(E)}$$\n\n" : "$$h(E) = e^{\\phi(E)}, \\quad m(x) = e^{\\beta_1 x - \\beta_2 x^2}$$\n\n");
        sb.Append("**Production**, with human capital H = h·L; on the balanced growth path output per effective worker is ŷ* = " + Num(r.SteadyState.OutputPerEffectiveWorker, 4) + ":\n\n")
          .Append("$$Y = K^{\\alpha} (A H)^{1-\\alpha}, \\quad \\ln \\hat{y}^{*} = \\frac{\\alpha}{1-\\alpha} \\ln \\frac{s}{n+g+\\delta}$$\n\n");
        sb.Append("**Output per person**, with technology A = 1 at the brief's date:\n\n")
          .Append("$$y = \\hat{y}^{*} \\cdot A \\cdot h(E) \\cdot \\omega(E)$$\n\n");
        sb.Append("**Output-maximising schooling** E* maximises h(E)·ω(E) over 0 ≤ E ≤ R − a₀. With a constant return r > n and rectangular survival, working years at the optimum are (1/r when n = 0):\n\n")
          .Append("$$W^{*} = \\frac{-\\ln(1 - n/r)}{n}, \\quad E^{*} = R - a_0 - W^{*}$$\n\n");
        sb.Append("**Method notes.** ");
        sb.Append(inputs.Demography.Survival is RectangularSurvival
            ? "Survival is rectangular, so the population integrals are in closed form, written to stay accurate at and near zero growth. "
            : "Population integrals use composite five-point Gauss–Legendre quadrature on panels of at most one year. ");
        sb.Append(r.Optimum.Method == OptimumMethod.ClosedForm
            ? "E* comes from the closed form and was checked against the numerical search. "
            : $"E* comes from a search over {r.Optimum.Diagnostics.GridPoints} grid points, each local maximum refined by {r.Optimum.Diagnostics.Refinement} to {Small(r.Optimum.Diagnostics.Tolerance)} of a year ({(r.Optimum.Diagnostics.Converged ? "converged" : "did not converge")}). ");
        sb.Append($"The band within 1% of the maximum is {Years(r.Optimum.Within1Pct[0])} to {Years(r.Optimum.Within1Pct[1])}.\n");
        return sb.ToString();
    }

    private static string ScheduleText(HumanCapital hc)
    {
        string schooling = hc.Returns switch
        {
            ConstantReturn c => $"φ(E) = r·E with r = {Pct(c.Rate)}",
            BracketReturns b => "φ piecewise linear with returns of " + string.Join(", ", b.Brackets.Select(x => $"{Pct(x.Rate)} from year {Num(x.FromYear, 0)}")),
            PowerReturn p => $"φ(E) = θ/(1−ψ)·E^(1−ψ) with θ = {Sig(p.Theta, 3)}, ψ = {Sig(p.Psi, 3)}",
            _ => "φ as given",
        };
        return hc.Experience is { } e
            ? $"{schooling}, times the average over working ages of the experience premium m(x) below with β₁ = {Sig(e.Linear, 3)}, β₂ = {Sig(e.Quadratic, 3)} (x = years of work)"
            : schooling;
    }
}
