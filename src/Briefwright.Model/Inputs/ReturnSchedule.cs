namespace Briefwright.Model.Inputs;

/// <summary>Log human capital from schooling, φ(E), so that h = e^φ(E).</summary>
public abstract record ReturnSchedule
{
    public abstract double Phi(double years);

    /// <summary>Marginal return φ'(E) (right derivative at bracket edges).</summary>
    public abstract double MarginalReturn(double years);
}

/// <summary>φ(E) = r·E.</summary>
public sealed record ConstantReturn(double Rate) : ReturnSchedule
{
    public override double Phi(double years) => Rate * years;
    public override double MarginalReturn(double years) => Rate;
}

/// <summary>
/// One bracket of a piecewise-linear schedule: from <see cref="FromYear"/> on, each year earns <see cref="Rate"/>.
/// </summary>
public sealed record ReturnBracket(double FromYear, double Rate);

/// <summary>Piecewise-linear φ: the return per year changes at bracket edges. The last bracket is open-ended.</summary>
public sealed record BracketReturns : ReturnSchedule
{
    public BracketReturns(IReadOnlyList<ReturnBracket> brackets)
    {
        if (brackets.Count == 0 || brackets[0].FromYear != 0)
            throw new ArgumentException("Return brackets must start at year 0.");
        Brackets = brackets.ToArray();
    }

    public IReadOnlyList<ReturnBracket> Brackets { get; }

    /// <summary>
    /// Hall &amp; Jones (1999), rates after Psacharopoulos (1994): 13.4% for years 0–4, 10.1% for 4–8, 6.8% beyond.
    /// </summary>
    public static BracketReturns HallJones { get; } = new(new[]
    {
        new ReturnBracket(0, 0.134), new ReturnBracket(4, 0.101), new ReturnBracket(8, 0.068),
    });

    public override double Phi(double years)
    {
        double phi = 0.0;
        for (int i = 0; i < Brackets.Count; i++)
        {
            double from = Brackets[i].FromYear;
            if (years <= from) break;
            double to = i + 1 < Brackets.Count ? Brackets[i + 1].FromYear : double.PositiveInfinity;
            phi += Brackets[i].Rate * (Math.Min(years, to) - from);
        }
        return phi;
    }

    public override double MarginalReturn(double years)
    {
        double rate = Brackets[0].Rate;
        foreach (var b in Brackets)
            if (years >= b.FromYear) rate = b.Rate;
        return rate;
    }

    public bool Equals(BracketReturns? other) => other is not null && Brackets.SequenceEqual(other.Brackets);
    public override int GetHashCode() => Brackets.Count;
}

/// <summary>Concave power form φ(E) = θ/(1−ψ)·E^(1−ψ) (Bils &amp; Klenow 2000).</summary>
public sealed record PowerReturn(double Theta, double Psi) : ReturnSchedule
{
    public override double Phi(double years) => years <= 0 ? 0.0 : Theta / (1 - Psi) * Math.Pow(years, 1 - Psi);
    public override double MarginalReturn(double years) =>
        years <= 0 ? double.PositiveInfinity : Theta * Math.Pow(years, -Psi);
}

/// <summary>Mincer experience profile: log earnings rise by β₁x − β₂x² with x years of work experience.</summary>
public sealed record ExperienceProfile(double Linear, double Quadratic)
{
    public double LogPremium(double experience) => Linear * experience - Quadratic * experience * experience;

    /// <summary>Experience at which the premium peaks, β₁/(2β₂).</summary>
    public double PeakYears => Linear / (2 * Quadratic);
}
