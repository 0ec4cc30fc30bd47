using Briefwright.Model.Numerics;

namespace Briefwright.Model.Inputs;

/// <summary>Survival curve l(a): the share of a birth cohort alive at age a, with l(0) = 1.</summary>
public abstract record Survival
{
    /// <summary>Age beyond which nobody is alive; the upper bound of every population integral.</summary>
    public abstract double MaxAge { get; }

    public abstract double At(double age);

    /// <summary>Ages where l(a) is not smooth; quadrature panels are aligned to them.</summary>
    public virtual IReadOnlyList<double> Breakpoints => Array.Empty<double>();
}

/// <summary>Everyone lives to <see cref="MaxAge"/> and then dies.</summary>
public sealed record RectangularSurvival(double MaxAge) : Survival
{
    public override double MaxAge { get; } = MaxAge;

    public override double At(double age) => age <= MaxAge ? 1.0 : 0.0;
}

/// <summary>
/// Gompertz–Makeham force of mortality μ(a) = A + B·c^a, so
/// l(a) = exp(−A·a − B/ln c · (c^a − 1)). Integrals are truncated at <see cref="MaxAge"/>.
/// </summary>
public sealed record GompertzMakehamSurvival(double A, double B, double C, double MaxAge) : Survival
{
    private readonly double lnC = Math.Log(C);
    private readonly double bOverLnC = B / Math.Log(C);

    public override double MaxAge { get; } = MaxAge;

    public override double At(double age) =>
        age > MaxAge ? 0.0 : Math.Exp(-A * age - bOverLnC * Stable.Expm1(age * lnC));
}

/// <summary>A life table: survivors at tabulated ages, linear between them, zero after the last age.</summary>
public sealed record TabulatedSurvival : Survival
{
    private readonly double[] ages;
    private readonly double[] survivors;

    public TabulatedSurvival(IReadOnlyList<double> ages, IReadOnlyList<double> survivors)
    {
        if (ages.Count != survivors.Count || ages.Count < 2)
            throw new ArgumentException("A life table needs at least two rows of age and survivors. Got " +
                $"{ages.Count} ages and {survivors.Count} values.");
        this.ages = ages.ToArray();
        this.survivors = survivors.ToArray();
    }

    public IReadOnlyList<double> Ages => ages;
    public IReadOnlyList<double> Survivors => survivors;
    public override double MaxAge => ages[^1];
    public override IReadOnlyList<double> Breakpoints => ages;

    public override double At(double age)
    {
        if (age <= ages[0]) return survivors[0];
        if (age > ages[^1]) return 0.0;
        int i = Array.BinarySearch(ages, age);
        if (i >= 0) return survivors[i];
        i = ~i;
        double t = (age - ages[i - 1]) / (ages[i] - ages[i - 1]);
        return survivors[i - 1] + t * (survivors[i] - survivors[i - 1]);
    }

    public bool Equals(TabulatedSurvival? other) =>
        other is not null && ages.AsSpan().SequenceEqual(other.ages)
            && survivors.AsSpan().SequenceEqual(other.survivors);

    public override int GetHashCode() => HashCode.Combine(ages.Length, ages[^1], survivors[^1]);
}
