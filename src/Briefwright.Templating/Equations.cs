using System.Text;
using Briefwright.Model.Inputs;
using Briefwright.Model.Results;

namespace Briefwright.Templating;

/// <summary>The technical annex: the model's equations and how each number was computed.</summary>
public sealed class Equations(BriefLanguage language) : TemplateFunctions(language)
{
    public string Annex(ModelInputs inputs, BalancedGrowthResults r)
    {
        var sb = new StringBuilder();
        sb.Append(T("eq.intro")).Append("\n\n");
        // Display equations in the math notation the composer typesets (docs/templates.md): $$ … $$ on their own; the
        // words around them are texts of the brief's language.
        sb.Append(T("eq.worker_share")).Append("\n\n")
          .Append("$$\\omega(E) = p \\cdot \\frac{\\int_{a_0+E}^{R} e^{-na}\\, l(a)\\, da}{\\int_{0}^{\\Omega} " +
              "e^{-na}\\, l(a)\\, da}$$\n\n");
        sb.Append(T("eq.human_capital", ScheduleText(inputs.HumanCapital))).Append("\n\n")
          .Append(inputs.HumanCapital.Experience is null
              ? "$$h(E) = e^{\\phi(E)}$$\n\n"
              : "$$h(E) = e^{\\phi(E)}, \\quad m(x) = e^{\\beta_1 x - \\beta_2 x^2}$$\n\n");
        sb.Append(T("eq.production", Num(r.SteadyState.OutputPerEffectiveWorker, 4))).Append("\n\n")
          .Append("$$Y = K^{\\alpha} (A H)^{1-\\alpha}, \\quad \\ln \\hat{y}^{*} = \\frac{\\alpha}{1-\\alpha} \\ln " +
              "\\frac{s}{n+g+\\delta}$$\n\n");
        sb.Append(T("eq.output_per_person")).Append("\n\n")
          .Append("$$y = \\hat{y}^{*} \\cdot A \\cdot h(E) \\cdot \\omega(E)$$\n\n");
        sb.Append(T("eq.optimum")).Append("\n\n")
          .Append("$$W^{*} = \\frac{-\\ln(1 - n/r)}{n}, \\quad E^{*} = R - a_0 - W^{*}$$\n\n");
        sb.Append("**").Append(T("eq.method_notes")).Append("** ");
        sb.Append(inputs.Demography.Survival is RectangularSurvival ? T("eq.rectangular") : T("eq.quadrature"))
            .Append(' ');
        sb.Append(r.Optimum.Method == OptimumMethod.ClosedForm
            ? T("eq.closed_form")
            : T(r.Optimum.Diagnostics.Converged ? "eq.search" : "eq.search_not_converged",
                r.Optimum.Diagnostics.GridPoints,
                ResultWords.Brief(this).Refinement(r.Optimum.Diagnostics.Refinement),
                Small(r.Optimum.Diagnostics.Tolerance)))
          .Append(' ');
        sb.Append(T("eq.band", Years(r.Optimum.Within1Pct[0]), Years(r.Optimum.Within1Pct[1]))).Append('\n');
        return sb.ToString();
    }

    private string ScheduleText(HumanCapital hc)
    {
        string schooling = hc.Returns switch
        {
            ConstantReturn c => T("eq.return_constant", Pct(c.Rate)),
            BracketReturns b => T("eq.return_brackets",
                string.Join(", ", b.Brackets.Select(x => T("eq.bracket", Pct(x.Rate), Num(x.FromYear, 0))))),
            PowerReturn p => T("eq.return_power", Sig(p.Theta, 3), Sig(p.Psi, 3)),
            _ => T("eq.return_given"),
        };
        return hc.Experience is { } e
            ? T("eq.experience", schooling, Sig(e.Linear, 3), Sig(e.Quadratic, 3))
            : schooling;
    }
}
