using Briefwright.Model.Inputs;

namespace Briefwright.Model.Tests;

internal static class Fixtures
{
    /// <summary>The textbook case: school from birth, work to death at T, everyone participates.</summary>
    public static Demography Classic(double lifespan, double n) =>
        new(n, EntryAge: 0, RetirementAge: lifespan, new RectangularSurvival(lifespan), Participation: 1.0);

    public static HumanCapital Constant(double r) => new(new ConstantReturn(r), null);

    public static Production MankiwRomerWeil
        => new(SavingRate: 0.2, CapitalShare: 1.0 / 3, Depreciation: 0.03, TechnologyGrowth: 0.02);
}
