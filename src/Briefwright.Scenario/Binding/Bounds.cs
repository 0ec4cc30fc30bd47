namespace Briefwright.Scenario.Binding;

/// <summary>An allowed interval for a number, with the rule text used in messages.</summary>
public readonly record struct Bounds(double Min, double Max, bool MinInclusive, bool MaxInclusive)
{
    public static Bounds Open(double min, double max) => new(min, max, false, false);
    public static Bounds Closed(double min, double max) => new(min, max, true, true);
    public static Bounds ClosedOpen(double min, double max) => new(min, max, true, false);
    public static Bounds OpenClosed(double min, double max) => new(min, max, false, true);

    public bool Contains(double v) =>
        (MinInclusive ? v >= Min : v > Min) && (MaxInclusive ? v <= Max : v < Max);

    public string Rule(bool asPercent)
    {
        string F(double x) => asPercent ? Numbers.Percent(x) : Numbers.Plain(x, 8);
        string lo = MinInclusive ? $"at least {F(Min)}" : $"greater than {F(Min)}";
        string hi = MaxInclusive ? $"at most {F(Max)}" : $"less than {F(Max)}";
        return $"must be {lo} and {hi}";
    }
}
